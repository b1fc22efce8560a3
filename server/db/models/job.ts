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
import type { JobStage } from '../../../shared/api/jobs';
import type { Customer } from './customer';
import type { Organisation } from './organisation';
import type { Space } from './space';
import type { User } from './user';

export class Job extends Model<InferAttributes<Job>, InferCreationAttributes<Job>> {
  declare id: CreationOptional<string>;
  declare organisationId: ForeignKey<Organisation['id']>;
  /** Per company and year, e.g. JOB-2026-0001. */
  declare reference: string;
  declare customerId: ForeignKey<Customer['id']>;
  declare addressLine1: string;
  declare addressLine2: string;
  declare town: string;
  declare postcode: string;
  declare stage: JobStage;
  declare assignedInstallerId: ForeignKey<User['id']> | null;
  /** 'YYYY-MM-DD' or null. */
  declare installDate: string | null;
  declare accessNotes: string;
  declare notes: string;
  declare createdById: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare customer?: NonAttribute<Customer>;
  declare assignedInstaller?: NonAttribute<User | null>;
  declare spaces?: NonAttribute<Space[]>;

  static initModel(sequelize: Sequelize) {
    Job.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        reference: { type: DataTypes.STRING(40), allowNull: false },
        addressLine1: { type: DataTypes.STRING(200), allowNull: false },
        addressLine2: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        town: { type: DataTypes.STRING(120), allowNull: false },
        postcode: { type: DataTypes.STRING(20), allowNull: false },
        stage: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'enquiry' },
        installDate: { type: DataTypes.DATEONLY, allowNull: true },
        accessNotes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'jobs' },
    );
  }
}
