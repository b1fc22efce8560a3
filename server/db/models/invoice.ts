import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type NonAttribute, type Sequelize } from 'sequelize';
import type { InvoiceLine } from './invoice-line';

/**
 * An invoice or a credit note. Amounts are integer minor units, fixed when issued. A paid invoice
 * is never changed; a correction is a credit note (kind 'credit_note', creditedInvoiceId set).
 */
export class Invoice extends Model<InferAttributes<Invoice>, InferCreationAttributes<Invoice>> {
  declare id: CreationOptional<string>;
  declare organisationId: string;
  declare jobId: string;
  declare quoteId: string | null;
  declare kind: 'invoice' | 'credit_note';
  declare series: string;
  declare seq: number;
  declare number: string;
  declare creditedInvoiceId: string | null;
  declare status: CreationOptional<'issued' | 'paid'>;
  declare issueDate: string;
  declare dueDate: string | null;
  declare currency: string;
  declare customerName: string;
  declare customerEmail: string;
  declare billingAddress: string[];
  declare netMinor: number;
  declare taxMinor: number;
  declare grossMinor: number;
  declare depositMinor: number;
  declare notes: CreationOptional<string>;
  declare reason: CreationOptional<string>;
  /** random, for the customer's private pay link; null on credit notes */
  declare payToken: string | null;
  declare sentAt: CreationOptional<Date | null>;
  declare paidAt: CreationOptional<Date | null>;
  declare createdById: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare lines?: NonAttribute<InvoiceLine[]>;

  static initModel(sequelize: Sequelize) {
    Invoice.init(
      {
        id: { type: DataTypes.UUID, defaultValue: DataTypes.UUIDV4, primaryKey: true },
        organisationId: { type: DataTypes.UUID, allowNull: false },
        jobId: { type: DataTypes.UUID, allowNull: false },
        quoteId: { type: DataTypes.UUID, allowNull: true },
        kind: { type: DataTypes.STRING(12), allowNull: false },
        series: { type: DataTypes.STRING(10), allowNull: false },
        seq: { type: DataTypes.INTEGER, allowNull: false },
        number: { type: DataTypes.STRING(40), allowNull: false },
        creditedInvoiceId: { type: DataTypes.UUID, allowNull: true },
        status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'issued' },
        issueDate: { type: DataTypes.DATEONLY, allowNull: false },
        dueDate: { type: DataTypes.DATEONLY, allowNull: true },
        currency: { type: DataTypes.STRING(3), allowNull: false },
        customerName: { type: DataTypes.STRING(200), allowNull: false },
        customerEmail: { type: DataTypes.STRING(254), allowNull: false, defaultValue: '' },
        billingAddress: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        netMinor: { type: DataTypes.INTEGER, allowNull: false },
        taxMinor: { type: DataTypes.INTEGER, allowNull: false },
        // The column keeps its first name; the attribute reads like the quote's totals (net, tax, gross).
        grossMinor: { type: DataTypes.INTEGER, allowNull: false, field: 'total_minor' },
        depositMinor: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        reason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        payToken: { type: DataTypes.STRING(64), allowNull: true },
        sentAt: { type: DataTypes.DATE, allowNull: true },
        paidAt: { type: DataTypes.DATE, allowNull: true },
        createdById: { type: DataTypes.UUID, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'invoices' },
    );
  }
}
