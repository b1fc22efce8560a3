import { DataTypes, literal, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// Site work: install settings, job sheet ticks, notes, photos, idempotency keys, completion.
const id = { type: DataTypes.UUID, primaryKey: true, allowNull: false, defaultValue: literal('gen_random_uuid()') };
const ts = { type: DataTypes.DATE, allowNull: false, defaultValue: literal('now()') };
const orgRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' };
const jobRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'jobs', key: 'id' }, onDelete: 'CASCADE' };
const spaceRef = { type: DataTypes.UUID, allowNull: false, references: { model: 'spaces', key: 'id' }, onDelete: 'CASCADE' };
const userRef = { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' };

export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('install_settings', {
    organisation_id: { ...orgRef, primaryKey: true },
    max_jobs_per_day: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
    max_area_m2_per_day: { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 120 },
    handover_r_values: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    handover_receipt: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
    created_at: ts,
    updated_at: ts,
  });

  await qi.createTable('job_ticks', {
    id,
    organisation_id: orgRef,
    job_id: jobRef,
    space_id: spaceRef,
    kind: { type: DataTypes.STRING(20), allowNull: false },
    ref: { type: DataTypes.STRING(120), allowNull: false },
    done: { type: DataTypes.BOOLEAN, allowNull: false },
    reason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    user_id: userRef,
    ticked_at: { type: DataTypes.DATE, allowNull: false },
    created_at: ts,
    updated_at: ts,
  });
  await qi.sequelize.query(`ALTER TABLE job_ticks ADD CONSTRAINT job_ticks_kind_check CHECK (kind IN ('strip-cut','strip-laid','check'))`);
  await qi.addIndex('job_ticks', ['job_id', 'space_id', 'kind', 'ref'], { unique: true });

  await qi.createTable('job_notes', {
    id,
    organisation_id: orgRef,
    job_id: jobRef,
    space_id: { ...spaceRef, allowNull: true },
    user_id: userRef,
    text: { type: DataTypes.TEXT, allowNull: false },
    noted_at: { type: DataTypes.DATE, allowNull: false },
    created_at: ts,
  });
  await qi.addIndex('job_notes', ['job_id', 'noted_at']);

  await qi.createTable('job_photos', {
    id,
    organisation_id: orgRef,
    job_id: jobRef,
    space_id: spaceRef,
    stage: { type: DataTypes.STRING(10), allowNull: false },
    caption: { type: DataTypes.STRING(500), allowNull: false, defaultValue: '' },
    storage_key: { type: DataTypes.STRING(300), allowNull: false },
    thumb_key: { type: DataTypes.STRING(300), allowNull: false },
    width_px: { type: DataTypes.INTEGER, allowNull: false },
    height_px: { type: DataTypes.INTEGER, allowNull: false },
    bytes: { type: DataTypes.INTEGER, allowNull: false },
    user_id: userRef,
    taken_at: { type: DataTypes.DATE, allowNull: false },
    created_at: ts,
  });
  await qi.sequelize.query(`ALTER TABLE job_photos ADD CONSTRAINT job_photos_stage_check CHECK (stage IN ('before','during','after'))`);
  await qi.addIndex('job_photos', ['job_id', 'space_id', 'stage']);

  // A POST made with an Idempotency-Key stores its first response here; a repeat replays it.
  await qi.createTable('idempotency_keys', {
    user_id: { type: DataTypes.UUID, allowNull: false, primaryKey: true, references: { model: 'users', key: 'id' }, onDelete: 'CASCADE' },
    key: { type: DataTypes.STRING(100), allowNull: false, primaryKey: true },
    organisation_id: orgRef,
    scope: { type: DataTypes.STRING(200), allowNull: false },
    status_code: { type: DataTypes.INTEGER, allowNull: false },
    response: { type: DataTypes.JSONB, allowNull: true },
    created_at: ts,
  });
  await qi.addIndex('idempotency_keys', ['created_at']);

  await qi.createTable('job_completions', {
    job_id: { ...jobRef, primaryKey: true },
    organisation_id: orgRef,
    user_id: userRef,
    completed_at: { type: DataTypes.DATE, allowNull: false },
    reasons: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
    handover_key: { type: DataTypes.STRING(300), allowNull: true },
    created_at: ts,
  });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  for (const t of ['job_completions', 'idempotency_keys', 'job_photos', 'job_notes', 'job_ticks', 'install_settings']) {
    await qi.dropTable(t);
  }
};
