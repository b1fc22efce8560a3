import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** The stored first response of a POST sent with an Idempotency-Key, replayed when the same key comes again. */
export class IdempotencyKey extends Model<InferAttributes<IdempotencyKey>, InferCreationAttributes<IdempotencyKey>> {
  declare userId: string;
  declare key: string;
  declare organisationId: string;
  /** `METHOD path`: a key reused on another endpoint is refused. */
  declare scope: string;
  declare statusCode: number;
  declare response: unknown;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    IdempotencyKey.init(
      {
        userId: { type: DataTypes.UUID, primaryKey: true },
        key: { type: DataTypes.STRING(100), primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        scope: { type: DataTypes.STRING(200), allowNull: false },
        statusCode: { type: DataTypes.INTEGER, allowNull: false },
        response: { type: DataTypes.JSONB, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'idempotency_keys', updatedAt: false },
    );
  }
}
