import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One line of an invoice or credit note; amounts fixed when the document is issued. */
export class InvoiceLine extends Model<InferAttributes<InvoiceLine>, InferCreationAttributes<InvoiceLine>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare invoiceId: string;
  declare position: number;
  declare source: 'quote' | 'variation' | 'credit';
  declare description: string;
  declare quantity: number;
  declare unit: string;
  declare unitPriceMinor: number;
  declare taxClass: string | null;
  declare rateBp: number;
  declare netMinor: number;
  declare taxMinor: number;

  static initModel(sequelize: Sequelize) {
    InvoiceLine.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        invoiceId: { type: DataTypes.UUID, allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false },
        source: { type: DataTypes.STRING(12), allowNull: false },
        description: { type: DataTypes.STRING(300), allowNull: false },
        quantity: { type: DataTypes.DOUBLE, allowNull: false },
        unit: { type: DataTypes.STRING(20), allowNull: false },
        unitPriceMinor: { type: DataTypes.INTEGER, allowNull: false },
        taxClass: { type: DataTypes.STRING(20), allowNull: true },
        rateBp: { type: DataTypes.INTEGER, allowNull: false },
        netMinor: { type: DataTypes.INTEGER, allowNull: false },
        taxMinor: { type: DataTypes.INTEGER, allowNull: false },
      },
      { sequelize, tableName: 'invoice_lines', timestamps: false },
    );
  }
}
