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
import type { PlanRevision } from './plan-revision';

/** One loft area of a job; its plan lives in plan_revisions. */
export class Space extends Model<InferAttributes<Space>, InferCreationAttributes<Space>> {
  declare id: CreationOptional<string>;
  declare organisationId: ForeignKey<Organisation['id']>;
  declare jobId: ForeignKey<Job['id']>;
  declare name: string;
  declare position: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  /** Set when the space is removed; the row and its revisions stay so the removal can be undone. */
  declare deletedAt: CreationOptional<Date | null>;
  declare job?: NonAttribute<Job>;
  declare revisions?: NonAttribute<PlanRevision[]>;

  static initModel(sequelize: Sequelize) {
    Space.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
        deletedAt: DataTypes.DATE,
      },
      // paranoid: destroy() sets deleted_at and every find (includes too) leaves such rows out.
      { sequelize, tableName: 'spaces', paranoid: true },
    );
  }
}
