import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A company's install settings: day capacity for scheduling and what the handover pack states. */
export class InstallSetting extends Model<InferAttributes<InstallSetting>, InferCreationAttributes<InstallSetting>> {
  declare organisationId: string;
  declare maxJobsPerDay: CreationOptional<number>;
  declare maxAreaM2PerDay: CreationOptional<number>;
  declare handoverRValues: CreationOptional<boolean>;
  declare handoverReceipt: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    InstallSetting.init(
      {
        organisationId: { type: DataTypes.UUID, primaryKey: true },
        maxJobsPerDay: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        maxAreaM2PerDay: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 120 },
        handoverRValues: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        handoverReceipt: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'install_settings' },
    );
  }
}
