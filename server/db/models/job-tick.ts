import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { TickKind } from '../../../shared/api/job-sheet';
import type { User } from './user';

/** The current state of one tick on a job sheet: a strip cut or laid, or a site check. One row per target. */
export class JobTick extends Model<InferAttributes<JobTick>, InferCreationAttributes<JobTick>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare jobId: string;
  declare spaceId: string;
  declare kind: TickKind;
  /** Strip id (`layerKey:number`) or site check code. */
  declare ref: string;
  declare done: boolean;
  declare reason: CreationOptional<string>;
  declare userId: string | null;
  declare tickedAt: Date;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare user?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    JobTick.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        jobId: { type: DataTypes.UUID, allowNull: false },
        spaceId: { type: DataTypes.UUID, allowNull: false },
        kind: { type: DataTypes.STRING(20), allowNull: false },
        ref: { type: DataTypes.STRING(120), allowNull: false },
        done: { type: DataTypes.BOOLEAN, allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        userId: { type: DataTypes.UUID, allowNull: true },
        tickedAt: { type: DataTypes.DATE, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'job_ticks' },
    );
  }
}
