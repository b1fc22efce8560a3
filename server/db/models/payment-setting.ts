import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { DepositMode } from '../../../shared/api/payments';
import type { Organisation } from './organisation';

/** One row per company: deposit rule and payment terms. Keys live in the environment, never here. */
export class PaymentSetting extends Model<InferAttributes<PaymentSetting>, InferCreationAttributes<PaymentSetting>> {
  declare organisationId: ForeignKey<Organisation['id']>;
  declare depositMode: DepositMode;
  /** basis points of the quote total (2500 = 25 %) */
  declare depositPercentBp: number | null;
  declare depositFixedMinor: number | null;
  declare paymentTermsDays: number;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PaymentSetting.init(
      {
        organisationId: { type: DataTypes.UUID, primaryKey: true },
        depositMode: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'none' },
        depositPercentBp: { type: DataTypes.INTEGER, allowNull: true },
        depositFixedMinor: { type: DataTypes.INTEGER, allowNull: true },
        paymentTermsDays: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 14 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'payment_settings' },
    );
  }
}
