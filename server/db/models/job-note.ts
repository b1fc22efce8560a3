import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';

/** A note written on the job sheet (on site, possibly offline and sent later). Insert-only. */
export class JobNote extends Model<InferAttributes<JobNote>, InferCreationAttributes<JobNote>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare jobId: string;
  declare spaceId: string | null;
  declare userId: string | null;
  declare text: string;
  declare notedAt: Date;
  declare createdAt: CreationOptional<Date>;
  declare user?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    JobNote.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        jobId: { type: DataTypes.UUID, allowNull: false },
        spaceId: { type: DataTypes.UUID, allowNull: true },
        userId: { type: DataTypes.UUID, allowNull: true },
        text: { type: DataTypes.TEXT, allowNull: false },
        notedAt: { type: DataTypes.DATE, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'job_notes', updatedAt: false },
    );
  }
}
