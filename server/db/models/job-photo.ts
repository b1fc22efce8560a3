import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { PhotoStage } from '../../../shared/api/job-sheet';
import type { User } from './user';

/** A site photo of one space; the image and its thumbnail live in storage under the two keys. */
export class JobPhoto extends Model<InferAttributes<JobPhoto>, InferCreationAttributes<JobPhoto>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare jobId: string;
  declare spaceId: string;
  declare stage: PhotoStage;
  declare caption: CreationOptional<string>;
  declare storageKey: string;
  declare thumbKey: string;
  declare widthPx: number;
  declare heightPx: number;
  declare bytes: number;
  declare userId: string | null;
  declare takenAt: Date;
  declare createdAt: CreationOptional<Date>;
  declare user?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    JobPhoto.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        jobId: { type: DataTypes.UUID, allowNull: false },
        spaceId: { type: DataTypes.UUID, allowNull: false },
        stage: { type: DataTypes.STRING(10), allowNull: false },
        caption: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
        storageKey: { type: DataTypes.STRING(300), allowNull: false },
        thumbKey: { type: DataTypes.STRING(300), allowNull: false },
        widthPx: { type: DataTypes.INTEGER, allowNull: false },
        heightPx: { type: DataTypes.INTEGER, allowNull: false },
        bytes: { type: DataTypes.INTEGER, allowNull: false },
        userId: { type: DataTypes.UUID, allowNull: true },
        takenAt: { type: DataTypes.DATE, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'job_photos', updatedAt: false },
    );
  }
}
