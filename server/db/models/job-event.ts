import {
  DataTypes,
  Model,
  type CreationOptional,
  type ForeignKey,
  type InferAttributes,
  type InferCreationAttributes,
  type NonAttribute,
  type Sequelize,
} from 'sequelize';
import type { Job } from './job';
import type { Organisation } from './organisation';
import type { User } from './user';

/** The timeline of a job: who did what, when. Insert-only. */
export class JobEvent extends Model<InferAttributes<JobEvent>, InferCreationAttributes<JobEvent>> {
  declare id: CreationOptional<string>;
  declare organisationId: ForeignKey<Organisation['id']>;
  declare jobId: ForeignKey<Job['id']>;
  declare userId: ForeignKey<User['id']> | null;
  /** e.g. created, updated, stage_changed, assigned, space_added; other modules add their own. */
  declare kind: string;
  declare data: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;
  /** Insertion order, numbered by the database: events written in the same millisecond keep their order. */
  declare seq: CreationOptional<string>;
  declare user?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    JobEvent.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        kind: { type: DataTypes.STRING(40), allowNull: false },
        data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        createdAt: DataTypes.DATE,
        seq: { type: DataTypes.BIGINT, autoIncrement: true },
      },
      { sequelize, tableName: 'job_events', updatedAt: false },
    );
  }
}
