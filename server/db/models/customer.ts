import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Organisation } from './organisation';

export class Customer extends Model<InferAttributes<Customer>, InferCreationAttributes<Customer>> {
  declare id: CreationOptional<string>;
  declare organisationId: ForeignKey<Organisation['id']>;
  declare name: string;
  declare email: string;
  declare phone: string;
  declare addressLine1: string;
  declare addressLine2: string;
  declare town: string;
  declare postcode: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Customer.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        name: { type: DataTypes.STRING(200), allowNull: false },
        email: { type: DataTypes.STRING(254), allowNull: false, defaultValue: '' },
        phone: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
        addressLine1: { type: DataTypes.STRING(200), allowNull: false },
        addressLine2: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
        town: { type: DataTypes.STRING(120), allowNull: false },
        postcode: { type: DataTypes.STRING(20), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'customers' },
    );
  }
}
