import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { TaxClass } from '../../../shared/api/settings';
import type { Organisation } from './organisation';

/** A company's tax rate for one class from a date (inclusive). */
export class TaxRate extends Model<InferAttributes<TaxRate>, InferCreationAttributes<TaxRate>> {
  declare id: CreationOptional<string>;
  declare organisationId: ForeignKey<Organisation['id']>;
  declare taxClass: TaxClass;
  declare rateBp: number;
  /** 'YYYY-MM-DD'. */
  declare validFrom: string;
  declare label: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    TaxRate.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        taxClass: { type: DataTypes.STRING(20), allowNull: false },
        rateBp: { type: DataTypes.INTEGER, allowNull: false },
        validFrom: { type: DataTypes.DATEONLY, allowNull: false },
        label: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'tax_rates' },
    );
  }
}
