import { DataTypes, Model, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * The next number of a company's series ('INV' invoices, 'CN' credit notes). Read with
 * SELECT … FOR UPDATE inside the transaction that inserts the document, so numbers have no gaps
 * and no duplicates even under concurrent creation.
 */
export class InvoiceCounter extends Model<InferAttributes<InvoiceCounter>, InferCreationAttributes<InvoiceCounter>> {
  declare organisationId: string;
  declare series: string;
  declare nextNumber: number;

  static initModel(sequelize: Sequelize) {
    InvoiceCounter.init(
      {
        organisationId: { type: DataTypes.UUID, primaryKey: true },
        series: { type: DataTypes.STRING(10), primaryKey: true },
        nextNumber: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
      },
      { sequelize, tableName: 'invoice_counters', timestamps: false },
    );
  }
}
