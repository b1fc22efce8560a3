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
import type { QuoteStatus } from '../../../shared/api/quotes';
import type { Job } from './job';
import type { Organisation } from './organisation';
import type { QuoteLine } from './quote-line';
import type { User } from './user';

/**
 * One version of a quote. Editing a sent quote inserts version n+1 under the same number and marks
 * the old row `superseded`; no sent version is ever changed.
 */
export class Quote extends Model<InferAttributes<Quote>, InferCreationAttributes<Quote>> {
  declare id: CreationOptional<string>;
  declare organisationId: ForeignKey<Organisation['id']>;
  declare jobId: ForeignKey<Job['id']>;
  declare number: string;
  declare version: number;
  declare status: QuoteStatus;
  declare currency: string;
  declare locale: string;
  declare issueDate: string;
  declare validUntil: string;
  declare notes: CreationOptional<string>;
  /** What the quote was built from: spaces (name, plan, takeoff summary), saving, labour hours, warnings. */
  declare snapshot: CreationOptional<Record<string, unknown>>;
  /** Random value baked into the private link; cleared or changed to invalidate older links. */
  declare linkNonce: CreationOptional<string | null>;
  declare sentAt: CreationOptional<Date | null>;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedName: CreationOptional<string | null>;
  declare declinedAt: CreationOptional<Date | null>;
  declare declineReason: CreationOptional<string | null>;
  declare createdById: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare lines?: NonAttribute<QuoteLine[]>;
  declare job?: NonAttribute<Job>;

  static initModel(sequelize: Sequelize) {
    Quote.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        number: { type: DataTypes.STRING(40), allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false },
        status: { type: DataTypes.STRING(20), allowNull: false },
        currency: { type: DataTypes.STRING(3), allowNull: false },
        locale: { type: DataTypes.STRING(20), allowNull: false },
        issueDate: { type: DataTypes.DATEONLY, allowNull: false },
        validUntil: { type: DataTypes.DATEONLY, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        snapshot: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        linkNonce: { type: DataTypes.STRING(64), allowNull: true },
        sentAt: { type: DataTypes.DATE, allowNull: true },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        acceptedName: { type: DataTypes.STRING(200), allowNull: true },
        declinedAt: { type: DataTypes.DATE, allowNull: true },
        declineReason: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'quotes' },
    );
  }
}
