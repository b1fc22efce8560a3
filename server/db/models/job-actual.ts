import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { Actuals } from '../../../shared/api/actuals';
import type { User } from './user';

/** What was really used on a finished job: one row per job, written with the finish; corrections bump `version`. */
export class JobActual extends Model<InferAttributes<JobActual>, InferCreationAttributes<JobActual>> {
  declare jobId: string;
  declare organisationId: string;
  declare rolls: Actuals['rolls'];
  declare hours: Actuals['hours'];
  declare extras: Actuals['extras'];
  declare recordedById: string | null;
  declare recordedAt: Date;
  declare version: CreationOptional<number>;
  declare editedById: CreationOptional<string | null>;
  declare editedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare recordedBy?: NonAttribute<User | null>;
  declare editedBy?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    JobActual.init(
      {
        jobId: { type: DataTypes.UUID, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        rolls: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        hours: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        extras: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        recordedById: { type: DataTypes.UUID, allowNull: true },
        recordedAt: { type: DataTypes.DATE, allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        editedById: { type: DataTypes.UUID, allowNull: true },
        editedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'job_actuals' },
    );
  }
}
