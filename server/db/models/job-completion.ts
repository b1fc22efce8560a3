import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';

/** A job marked installed: who, when, the reasons for any check not ticked, and the handover pack's storage key. */
export class JobCompletion extends Model<InferAttributes<JobCompletion>, InferCreationAttributes<JobCompletion>> {
  declare jobId: string;
  declare organisationId: string;
  declare userId: string | null;
  declare completedAt: Date;
  declare reasons: CreationOptional<Record<string, string>>;
  declare handoverKey: string | null;
  /** The Idempotency-Key of the finish request, so its resend is answered as done rather than refused. */
  declare finishKey: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare user?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    JobCompletion.init(
      {
        jobId: { type: DataTypes.UUID, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        userId: { type: DataTypes.UUID, allowNull: true },
        completedAt: { type: DataTypes.DATE, allowNull: false },
        reasons: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        handoverKey: { type: DataTypes.STRING(300), allowNull: true },
        finishKey: { type: DataTypes.STRING(100), allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'job_completions', updatedAt: false },
    );
  }
}
