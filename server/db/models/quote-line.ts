import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { TaxClass } from '../../../shared/api/settings';
import type { LineKind } from '../../../shared/quote/totals';
import type { Organisation } from './organisation';
import type { Quote } from './quote';

/** One line of one quote version. Money in minor units; quantity to three decimals. */
export class QuoteLine extends Model<InferAttributes<QuoteLine>, InferCreationAttributes<QuoteLine>> {
  declare id: CreationOptional<string>;
  declare organisationId: ForeignKey<Organisation['id']>;
  declare quoteId: ForeignKey<Quote['id']>;
  declare position: number;
  declare kind: LineKind;
  declare description: string;
  declare quantity: number;
  declare unit: string;
  declare unitPriceMinor: number;
  declare unitCostMinor: number;
  declare taxClass: TaxClass;
  declare productId: string | null;
  declare extraKind: string | null;
  declare altQuantity: number | null;
  declare note: string;

  static initModel(sequelize: Sequelize) {
    QuoteLine.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        position: { type: DataTypes.INTEGER, allowNull: false },
        kind: { type: DataTypes.STRING(20), allowNull: false },
        description: { type: DataTypes.STRING(300), allowNull: false },
        quantity: { type: DataTypes.DOUBLE, allowNull: false },
        unit: { type: DataTypes.STRING(20), allowNull: false },
        unitPriceMinor: { type: DataTypes.INTEGER, allowNull: false },
        unitCostMinor: { type: DataTypes.INTEGER, allowNull: false },
        taxClass: { type: DataTypes.STRING(20), allowNull: false },
        productId: { type: DataTypes.STRING(80), allowNull: true },
        extraKind: { type: DataTypes.STRING(40), allowNull: true },
        altQuantity: { type: DataTypes.DOUBLE, allowNull: true },
        note: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
      },
      { sequelize, tableName: 'quote_lines', timestamps: false },
    );
  }
}
