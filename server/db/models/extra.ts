import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { ExtraKind, TaxClass } from '../../../shared/api/settings';
import type { Organisation } from './organisation';

/** An extra item with a price and fitting time (hatch kit, tank jacket, covers, boards, disposal). */
export class Extra extends Model<InferAttributes<Extra>, InferCreationAttributes<Extra>> {
  declare id: CreationOptional<string>;
  declare organisationId: ForeignKey<Organisation['id']>;
  declare kind: ExtraKind;
  declare name: string;
  declare unit: 'each' | 'm' | 'job';
  declare unitPriceMinor: number;
  declare unitCostMinor: number;
  declare minutesPerUnit: number;
  declare taxClass: TaxClass;
  declare active: boolean;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Extra.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        kind: { type: DataTypes.STRING(30), allowNull: false },
        name: { type: DataTypes.STRING(160), allowNull: false },
        unit: { type: DataTypes.STRING(10), allowNull: false },
        unitPriceMinor: { type: DataTypes.INTEGER, allowNull: false },
        unitCostMinor: { type: DataTypes.INTEGER, allowNull: false },
        minutesPerUnit: { type: DataTypes.DOUBLE, allowNull: false },
        taxClass: { type: DataTypes.STRING(20), allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'extras' },
    );
  }
}
