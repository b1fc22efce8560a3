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
import type { Plan } from '../../../shared/plan/plan-schema';
import type { Organisation } from './organisation';
import type { Space } from './space';
import type { User } from './user';

/**
 * One saved version of a space's plan. Rows are only ever inserted: a save is a new revision
 * (1, 2, 3, ... per space), never an update of an older one.
 */
export class PlanRevision extends Model<InferAttributes<PlanRevision>, InferCreationAttributes<PlanRevision>> {
  declare id: CreationOptional<string>;
  declare organisationId: ForeignKey<Organisation['id']>;
  declare spaceId: ForeignKey<Space['id']>;
  declare revision: number;
  /** The plan JSON (`quiltline-plan/1`) as parsed by planSchema. */
  declare plan: Plan;
  /** The computed takeoff saved beside the plan (filled by the plans module); null when not computed. */
  declare takeoff: CreationOptional<Record<string, unknown> | null>;
  declare authorId: ForeignKey<User['id']> | null;
  declare note: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare author?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    PlanRevision.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        revision: { type: DataTypes.INTEGER, allowNull: false },
        plan: { type: DataTypes.JSONB, allowNull: false },
        takeoff: { type: DataTypes.JSONB, allowNull: true },
        note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'plan_revisions', updatedAt: false },
    );
  }
}
