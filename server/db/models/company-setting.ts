import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Address } from '../../../shared/api/customers';
import type { ActualsPart, ExtraRules, LabourSettings } from '../../../shared/api/settings';
import type { Organisation } from './organisation';

/** One row per company: details printed on quotes, pricing and savings settings. */
export class CompanySetting extends Model<InferAttributes<CompanySetting>, InferCreationAttributes<CompanySetting>> {
  declare organisationId: ForeignKey<Organisation['id']>;
  declare companyName: string;
  declare address: Address;
  declare email: string;
  declare phone: string;
  declare taxNumber: string;
  declare terms: string;
  declare validityDays: number;
  declare currency: string;
  declare locale: string;
  declare degreeDays: number;
  declare fuelPriceMinorPerKwh: number;
  declare heatingEfficiency: number;
  declare wasteAllowance: number;
  declare minOffcutMm: number;
  declare rollCountMethod: 'packing' | 'area';
  declare eavesMode: 'gap' | 'ventilators';
  declare hatchKitInsulationMm: number;
  declare actualsRequired: CreationOptional<ActualsPart[]>;
  declare labour: LabourSettings;
  declare extraRules: ExtraRules;
  declare logoKey: CreationOptional<string | null>;
  declare logoType: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    CompanySetting.init(
      {
        organisationId: { type: DataTypes.UUID, primaryKey: true },
        companyName: { type: DataTypes.STRING(200), allowNull: false },
        address: { type: DataTypes.JSONB, allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false, defaultValue: '' },
        phone: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
        taxNumber: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
        terms: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        validityDays: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false },
        locale: { type: DataTypes.STRING(20), allowNull: false },
        degreeDays: { type: DataTypes.DOUBLE, allowNull: false },
        fuelPriceMinorPerKwh: { type: DataTypes.DOUBLE, allowNull: false },
        heatingEfficiency: { type: DataTypes.DOUBLE, allowNull: false },
        wasteAllowance: { type: DataTypes.DOUBLE, allowNull: false },
        minOffcutMm: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 500 },
        rollCountMethod: { type: DataTypes.STRING(10), allowNull: false },
        eavesMode: { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'gap' },
        hatchKitInsulationMm: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
        actualsRequired: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        labour: { type: DataTypes.JSONB, allowNull: false },
        extraRules: { type: DataTypes.JSONB, allowNull: false },
        logoKey: { type: DataTypes.STRING(300), allowNull: true },
        logoType: { type: DataTypes.STRING(40), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'company_settings' },
    );
  }
}
