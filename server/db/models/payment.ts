import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/**
 * One attempt to collect money through the hosted checkout (one Checkout Session). A cancelled
 * checkout leaves its row open; a retry makes a new row. Only the signed webhook sets `paid`.
 */
export class Payment extends Model<InferAttributes<Payment>, InferCreationAttributes<Payment>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare jobId: string;
  declare quoteId: string | null;
  declare invoiceId: string | null;
  declare purpose: 'deposit' | 'balance';
  /** `refunded`: a completion that was not counted (expired or replaced checkout, second deposit) and was paid back. */
  declare status: CreationOptional<'open' | 'paid' | 'expired' | 'refunded'>;
  declare amountMinor: number;
  declare currency: string;
  /** random, for the public success/cancel/retry pages */
  declare token: string;
  declare checkoutSessionId: string | null;
  declare checkoutUrl: string | null;
  declare paymentIntentId: CreationOptional<string | null>;
  declare paidAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Payment.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        jobId: { type: DataTypes.UUID, allowNull: false },
        quoteId: { type: DataTypes.UUID, allowNull: true },
        invoiceId: { type: DataTypes.UUID, allowNull: true },
        purpose: { type: DataTypes.STRING(10), allowNull: false },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'open' },
        amountMinor: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false },
        token: { type: DataTypes.STRING(64), allowNull: false },
        checkoutSessionId: { type: DataTypes.STRING(255), allowNull: true },
        checkoutUrl: { type: DataTypes.TEXT, allowNull: true },
        paymentIntentId: { type: DataTypes.STRING(255), allowNull: true },
        paidAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'payments' },
    );
  }
}
