import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { TaxClass } from '../../../shared/api/settings';
import type { Organisation } from './organisation';

/** A roll product in a company's catalogue. */
export class Product extends Model<InferAttributes<Product>, InferCreationAttributes<Product>> {
  declare id: CreationOptional<string>;
  declare organisationId: ForeignKey<Organisation['id']>;
  declare name: string;
  declare supplierCode: string;
  declare thicknessMm: number;
  declare rollWidthMm: number;
  declare lanes: number;
  declare rollLengthMm: number;
  declare coverageM2: number;
  declare lambdaWmK: number;
  declare unitPriceMinor: number;
  declare unitCostMinor: number;
  declare taxClass: TaxClass;
  declare roles: Array<'base' | 'cross'>;
  declare active: boolean;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Product.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(160), allowNull: false },
        supplierCode: { type: DataTypes.STRING(60), allowNull: false, defaultValue: '' },
        thicknessMm: { type: DataTypes.DOUBLE, allowNull: false },
        rollWidthMm: { type: DataTypes.DOUBLE, allowNull: false },
        lanes: { type: DataTypes.INTEGER, allowNull: false },
        rollLengthMm: { type: DataTypes.DOUBLE, allowNull: false },
        coverageM2: { type: DataTypes.DOUBLE, allowNull: false },
        lambdaWmK: { type: DataTypes.DOUBLE, allowNull: false, field: 'lambda_w_mk' },
        unitPriceMinor: { type: DataTypes.INTEGER, allowNull: false },
        unitCostMinor: { type: DataTypes.INTEGER, allowNull: false },
        taxClass: { type: DataTypes.STRING(20), allowNull: false },
        roles: { type: DataTypes.JSONB, allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'products' },
    );
  }
}
