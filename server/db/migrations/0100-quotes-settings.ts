import { DataTypes, literal, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// Company settings, catalogue (products, extras), dated tax rates,
// quotes with versions and their lines.
const id = { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: literal('gen_random_uuid()') };
const ts = { type: DataTypes.DATE, allowNull: false, defaultValue: literal('now()') };
const orgRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' };
const money = { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 };
const taxClass = { type: DataTypes.STRING(20), allowNull: false };

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('company_settings', {
    organisation_id: { ...orgRef, primaryKey: true },
    company_name: { type: DataTypes.STRING(200), allowNull: false },
    address: { type: DataTypes.JSONB, allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false, defaultValue: '' },
    phone: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
    tax_number: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
    terms: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    validity_days: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 30 },
    currency: { type: DataTypes.STRING(3), allowNull: false, defaultValue: 'GBP' },
    locale: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'en-GB' },
    degree_days: { type: DataTypes.DOUBLE, allowNull: false },
    fuel_price_minor_per_kwh: { type: DataTypes.DOUBLE, allowNull: false },
    heating_efficiency: { type: DataTypes.DOUBLE, allowNull: false },
    waste_allowance: { type: DataTypes.DOUBLE, allowNull: false },
    roll_count_method: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'packing' },
    labour: { type: DataTypes.JSONB, allowNull: false },
    extra_rules: { type: DataTypes.JSONB, allowNull: false },
    logo_key: { type: DataTypes.STRING(300), allowNull: true },
    logo_type: { type: DataTypes.STRING(40), allowNull: true },
    created_at: ts,
    updated_at: ts,
  });

  await qi.createTable('products', {
    id,
    organisation_id: orgRef,
    name: { type: DataTypes.STRING(160), allowNull: false },
    supplier_code: { type: DataTypes.STRING(60), allowNull: false, defaultValue: '' },
    thickness_mm: { type: DataTypes.DOUBLE, allowNull: false },
    roll_width_mm: { type: DataTypes.DOUBLE, allowNull: false },
    lanes: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    roll_length_mm: { type: DataTypes.DOUBLE, allowNull: false },
    coverage_m2: { type: DataTypes.DOUBLE, allowNull: false },
    lambda_w_mk: { type: DataTypes.DOUBLE, allowNull: false },
    unit_price_minor: money,
    unit_cost_minor: money,
    tax_class: taxClass,
    roles: { type: DataTypes.JSONB, allowNull: false, defaultValue: ['base', 'cross'] },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: ts,
    updated_at: ts,
  });
  await qi.addIndex('products', ['organisation_id', 'name']);

  await qi.createTable('extras', {
    id,
    organisation_id: orgRef,
    kind: { type: DataTypes.STRING(30), allowNull: false },
    name: { type: DataTypes.STRING(160), allowNull: false },
    unit: { type: DataTypes.STRING(10), allowNull: false, defaultValue: 'each' },
    unit_price_minor: money,
    unit_cost_minor: money,
    minutes_per_unit: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 },
    tax_class: taxClass,
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: ts,
    updated_at: ts,
  });
  await qi.addIndex('extras', ['organisation_id', 'kind']);

  await qi.createTable('tax_rates', {
    id,
    organisation_id: orgRef,
    tax_class: taxClass,
    rate_bp: { type: DataTypes.INTEGER, allowNull: false },
    valid_from: { type: DataTypes.DATEONLY, allowNull: false },
    label: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
    created_at: ts,
    updated_at: ts,
  });
  await qi.addIndex('tax_rates', ['organisation_id', 'tax_class', 'valid_from'], { unique: true });

  await qi.createTable('quote_number_counters', {
    organisation_id: { ...orgRef, primaryKey: true },
    last_number: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  });

  await qi.createTable('quotes', {
    id,
    organisation_id: orgRef,
    job_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'jobs', key: 'id' }, onDelete: 'CASCADE' },
    number: { type: DataTypes.STRING(40), allowNull: false },
    version: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    status: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'draft' },
    currency: { type: DataTypes.STRING(3), allowNull: false },
    locale: { type: DataTypes.STRING(20), allowNull: false },
    issue_date: { type: DataTypes.DATEONLY, allowNull: false },
    valid_until: { type: DataTypes.DATEONLY, allowNull: false },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    snapshot: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    link_nonce: { type: DataTypes.STRING(64), allowNull: true },
    sent_at: { type: DataTypes.DATE, allowNull: true },
    accepted_at: { type: DataTypes.DATE, allowNull: true },
    accepted_name: { type: DataTypes.STRING(200), allowNull: true },
    declined_at: { type: DataTypes.DATE, allowNull: true },
    decline_reason: { type: DataTypes.TEXT, allowNull: true },
    created_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: ts,
    updated_at: ts,
  });
  await qi.sequelize.query(
    `ALTER TABLE quotes ADD CONSTRAINT quotes_status_check CHECK (status IN ('draft','sent','accepted','declined','expired','superseded'))`,
  );
  await qi.addIndex('quotes', ['organisation_id', 'number', 'version'], { unique: true });
  await qi.addIndex('quotes', ['job_id']);

  await qi.createTable('quote_lines', {
    id,
    organisation_id: orgRef,
    quote_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'quotes', key: 'id' }, onDelete: 'CASCADE' },
    position: { type: DataTypes.INTEGER, allowNull: false },
    kind: { type: DataTypes.STRING(20), allowNull: false },
    description: { type: DataTypes.STRING(300), allowNull: false },
    quantity: { type: DataTypes.DOUBLE, allowNull: false },
    unit: { type: DataTypes.STRING(20), allowNull: false },
    unit_price_minor: money,
    unit_cost_minor: money,
    tax_class: taxClass,
    product_id: { type: DataTypes.STRING(80), allowNull: true },
    extra_kind: { type: DataTypes.STRING(40), allowNull: true },
    alt_quantity: { type: DataTypes.DOUBLE, allowNull: true },
    note: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
  });
  await qi.addIndex('quote_lines', ['quote_id', 'position']);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  for (const t of ['quote_lines', 'quotes', 'quote_number_counters', 'tax_rates', 'extras', 'products', 'company_settings']) {
    await qi.dropTable(t);
  }
};
