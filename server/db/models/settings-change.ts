import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { User } from './user';

/** One change of a company setting made from a suggestion: who, when, from what to what. Insert-only. */
export class SettingsChange extends Model<InferAttributes<SettingsChange>, InferCreationAttributes<SettingsChange>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare userId: string | null;
  declare setting: string;
  declare oldValue: unknown;
  declare newValue: unknown;
  declare note: CreationOptional<string>;
  declare createdAt: CreationOptional<Date>;
  declare user?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    SettingsChange.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        userId: { type: DataTypes.UUID, allowNull: true },
        setting: { type: DataTypes.STRING(60), allowNull: false },
        oldValue: { type: DataTypes.JSONB, allowNull: true },
        newValue: { type: DataTypes.JSONB, allowNull: true },
        note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'settings_changes', updatedAt: false },
    );
  }
}
