import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Every webhook event id handled once: the primary key makes a replay a no-op. */
export class PaymentEvent extends Model<InferAttributes<PaymentEvent>, InferCreationAttributes<PaymentEvent>> {
  declare eventId: string;
  declare type: string;
  declare organisationId: string | null;
  declare paymentId: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PaymentEvent.init(
      {
        eventId: { type: DataTypes.STRING(255), primaryKey: true },
        type: { type: DataTypes.STRING(80), allowNull: false },
        organisationId: { type: DataTypes.UUID, allowNull: true },
        paymentId: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'payment_events', updatedAt: false },
    );
  }
}
