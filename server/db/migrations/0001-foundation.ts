import { DataTypes, literal, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

const id = { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: literal('gen_random_uuid()') };
const ts = { type: DataTypes.DATE, allowNull: false, defaultValue: literal('now()') };
const orgRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' };
const addressCols = {
  address_line1: { type: DataTypes.STRING(200), allowNull: false },
  address_line2: { type: DataTypes.STRING(200), allowNull: false, defaultValue: '' },
  town: { type: DataTypes.STRING(120), allowNull: false },
  postcode: { type: DataTypes.STRING(20), allowNull: false },
};

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('organisations', {
    id,
    name: { type: DataTypes.STRING(200), allowNull: false },
    created_at: ts,
    updated_at: ts,
  });

  await qi.createTable('users', {
    id,
    organisation_id: orgRef,
    email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
    name: { type: DataTypes.STRING(120), allowNull: false },
    role: { type: DataTypes.STRING(20), allowNull: false },
    password_hash: { type: DataTypes.STRING(100), allowNull: true },
    active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
    created_at: ts,
    updated_at: ts,
  });
  await qi.sequelize.query(`ALTER TABLE users ADD CONSTRAINT users_role_check CHECK (role IN ('office','estimator','installer'))`);
  await qi.sequelize.query(`ALTER TABLE users ADD CONSTRAINT users_email_lower_check CHECK (email = lower(email))`);
  await qi.addIndex('users', ['organisation_id']);

  await qi.createTable('customers', {
    id,
    organisation_id: orgRef,
    name: { type: DataTypes.STRING(200), allowNull: false },
    email: { type: DataTypes.STRING(254), allowNull: false, defaultValue: '' },
    phone: { type: DataTypes.STRING(40), allowNull: false, defaultValue: '' },
    ...addressCols,
    created_at: ts,
    updated_at: ts,
  });
  await qi.addIndex('customers', ['organisation_id', 'name']);

  await qi.createTable('job_reference_counters', {
    organisation_id: { ...orgRef, primaryKey: true },
    year: { type: DataTypes.INTEGER, allowNull: false, primaryKey: true },
    last_number: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
  });

  await qi.createTable('jobs', {
    id,
    organisation_id: orgRef,
    reference: { type: DataTypes.STRING(40), allowNull: false },
    customer_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'customers', key: 'id' }, onDelete: 'RESTRICT' },
    ...addressCols,
    stage: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'enquiry' },
    assigned_installer_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    install_date: { type: DataTypes.DATEONLY, allowNull: true },
    access_notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    created_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    created_at: ts,
    updated_at: ts,
  });
  await qi.sequelize.query(
    `ALTER TABLE jobs ADD CONSTRAINT jobs_stage_check CHECK (stage IN ('enquiry','surveyed','quoted','accepted','scheduled','installed','closed','declined'))`,
  );
  await qi.addIndex('jobs', ['organisation_id', 'reference'], { unique: true });
  await qi.addIndex('jobs', ['organisation_id', 'stage']);
  await qi.addIndex('jobs', ['assigned_installer_id']);
  await qi.addIndex('jobs', ['customer_id']);

  await qi.createTable('spaces', {
    id,
    organisation_id: orgRef,
    job_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'jobs', key: 'id' }, onDelete: 'CASCADE' },
    name: { type: DataTypes.STRING(120), allowNull: false },
    position: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
    created_at: ts,
    updated_at: ts,
  });
  await qi.addIndex('spaces', ['job_id']);

  await qi.createTable('plan_revisions', {
    id,
    organisation_id: orgRef,
    space_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'spaces', key: 'id' }, onDelete: 'CASCADE' },
    revision: { type: DataTypes.INTEGER, allowNull: false },
    plan: { type: DataTypes.JSONB, allowNull: false },
    takeoff: { type: DataTypes.JSONB, allowNull: true },
    author_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    note: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    created_at: ts,
  });
  await qi.addIndex('plan_revisions', ['space_id', 'revision'], { unique: true });

  await qi.createTable('auth_tokens', {
    id,
    organisation_id: orgRef,
    user_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    purpose: { type: DataTypes.STRING(20), allowNull: false },
    token_hash: { type: DataTypes.STRING(64), allowNull: false, unique: true },
    expires_at: { type: DataTypes.DATE, allowNull: false },
    used_at: { type: DataTypes.DATE, allowNull: true },
    created_at: ts,
  });
  await qi.sequelize.query(`ALTER TABLE auth_tokens ADD CONSTRAINT auth_tokens_purpose_check CHECK (purpose IN ('invite','reset'))`);
  await qi.addIndex('auth_tokens', ['user_id']);

  await qi.createTable('job_events', {
    id,
    organisation_id: orgRef,
    job_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'jobs', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    kind: { type: DataTypes.STRING(40), allowNull: false },
    data: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    created_at: ts,
  });
  await qi.addIndex('job_events', ['job_id', 'created_at']);

  // connect-pg-simple's table (its own table.sql), so sessions need no create-on-first-use.
  await qi.sequelize.query(`
    CREATE TABLE "session" (
      "sid" varchar NOT NULL COLLATE "default" PRIMARY KEY,
      "sess" json NOT NULL,
      "expire" timestamp(6) NOT NULL
    );
    CREATE INDEX "IDX_session_expire" ON "session" ("expire");
  `);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  for (const t of [
    'session',
    'job_events',
    'auth_tokens',
    'plan_revisions',
    'spaces',
    'jobs',
    'job_reference_counters',
    'customers',
    'users',
    'organisations',
  ]) {
    await qi.dropTable(t);
  }
};
