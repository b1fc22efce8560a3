import { DataTypes, literal, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// Payment settings, checkout payments, handled webhook events,
// gap-free invoice/credit note counters, invoices and their lines.
const id = { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: literal('gen_random_uuid()') };
const ts = { type: DataTypes.DATE, allowNull: false, defaultValue: literal('now()') };
const orgRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' };
const jobRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'jobs', key: 'id' }, onDelete: 'CASCADE' };
const quoteRef = { type: DataTypes.UUID, allowNull: true, references: { model: 'quotes', key: 'id' }, onDelete: 'SET NULL' };
const minor = { type: DataTypes.INTEGER, allowNull: false };

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('payment_settings', {
    organisation_id: { ...orgRef, primaryKey: true },
    deposit_mode: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'none' },
    deposit_percent_bp: { type: DataTypes.INTEGER, allowNull: true },
    deposit_fixed_minor: { type: DataTypes.INTEGER, allowNull: true },
    payment_terms_days: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 14 },
    created_at: ts,
    updated_at: ts,
  });
  await qi.sequelize.query(`ALTER TABLE payment_settings ADD CONSTRAINT payment_settings_mode_chk CHECK (deposit_mode IN ('none','percent','fixed'))`);

  await qi.createTable('invoice_counters', {
    organisation_id: { ...orgRef, primaryKey: true },
    series: { type: DataTypes.STRING(10), primaryKey: true, allowNull: false },
    next_number: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
  });

  await qi.createTable('invoices', {
    id,
    organisation_id: orgRef,
    job_id: jobRef,
    quote_id: quoteRef,
    kind: { type: DataTypes.STRING(12), allowNull: false },
    series: { type: DataTypes.STRING(10), allowNull: false },
    seq: { type: DataTypes.INTEGER, allowNull: false },
    number: { type: DataTypes.STRING(40), allowNull: false },
    credited_invoice_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'invoices', key: 'id' }, onDelete: 'RESTRICT' },
    status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'issued' },
    issue_date: { type: DataTypes.DATEONLY, allowNull: false },
    due_date: { type: DataTypes.DATEONLY, allowNull: true },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    customer_name: { type: DataTypes.STRING(200), allowNull: false },
    customer_email: { type: DataTypes.STRING(254), allowNull: false, defaultValue: '' },
    billing_address: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    net_minor: minor,
    tax_minor: minor,
    total_minor: minor,
    deposit_minor: { ...minor, defaultValue: 0 },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    reason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    pay_token: { type: DataTypes.STRING(64), allowNull: true, unique: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    paid_at: { type: DataTypes.DATE, allowNull: true },
    created_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: ts,
    updated_at: ts,
  });
  await qi.addIndex('invoices', ['organisation_id', 'series', 'seq'], { unique: true, name: 'invoices_org_series_seq_uq' });
  // One invoice per job; credit notes correct it.
  await qi.sequelize.query(`CREATE UNIQUE INDEX invoices_one_per_job_uq ON invoices (job_id) WHERE kind = 'invoice'`);
  await qi.addIndex('invoices', ['organisation_id', 'status']);
  await qi.sequelize.query(
    `ALTER TABLE invoices ADD CONSTRAINT invoices_kind_chk CHECK (kind IN ('invoice','credit_note')), ADD CONSTRAINT invoices_status_chk CHECK (status IN ('issued','paid'))`,
  );

  await qi.createTable('invoice_lines', {
    id,
    organisation_id: orgRef,
    invoice_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'invoices', key: 'id' }, onDelete: 'CASCADE' },
    position: { type: DataTypes.INTEGER, allowNull: false },
    source: { type: DataTypes.STRING(12), allowNull: false },
    description: { type: DataTypes.STRING(300), allowNull: false },
    quantity: { type: DataTypes.DOUBLE, allowNull: false },
    unit: { type: DataTypes.STRING(20), allowNull: false },
    unit_price_minor: minor,
    tax_class: { type: DataTypes.STRING(20), allowNull: true },
    rate_bp: minor,
    net_minor: minor,
    tax_minor: minor,
  });
  await qi.addIndex('invoice_lines', ['invoice_id', 'position']);

  await qi.createTable('payments', {
    id,
    organisation_id: orgRef,
    job_id: jobRef,
    quote_id: quoteRef,
    invoice_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'invoices', key: 'id' }, onDelete: 'SET NULL' },
    purpose: { type: DataTypes.STRING(10), allowNull: false },
    status: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'open' },
    amount_minor: minor,
    currency: { type: DataTypes.STRING(3), allowNull: false },
    token: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    checkout_session_id: { type: DataTypes.STRING(255), allowNull: true, unique: true },
    checkout_url: { type: DataTypes.TEXT, allowNull: true },
    payment_intent_id: { type: DataTypes.STRING(255), allowNull: true },
    paid_at: { type: DataTypes.DATE, allowNull: true },
    created_at: ts,
    updated_at: ts,
  });
  await qi.addIndex('payments', ['quote_id']);
  await qi.addIndex('payments', ['invoice_id']);
  await qi.addIndex('payments', ['organisation_id', 'job_id']);

  await qi.createTable('payment_events', {
    event_id: { type: DataTypes.STRING(255), primaryKey: true, allowNull: false },
    type: { type: DataTypes.STRING(80), allowNull: false },
    organisation_id: { type: DataTypes.UUID, allowNull: true },
    payment_id: { type: DataTypes.UUID, allowNull: true },
    created_at: ts,
  });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  for (const t of ['payment_events', 'payments', 'invoice_lines', 'invoices', 'invoice_counters', 'payment_settings']) await qi.dropTable(t);
};
