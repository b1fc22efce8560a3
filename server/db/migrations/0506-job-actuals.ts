import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// What was really used on a finished job (one row per job: rolls per product, hours per installer,
// extras), the key of the finish request that recorded it (so a resent finish is answered, not
// doubled), what the company asks installers to record, and the audit of settings changed from the
// estimate-against-actual suggestions.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.createTable('job_actuals', {
    job_id: { type: DataTypes.UUID, primaryKey: true, references: { model: 'jobs', key: 'id' }, onDelete: 'CASCADE' },
    organisation_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' },
    rolls: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    hours: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    extras: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
    recorded_by_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    recorded_at: { type: DataTypes.DATE, allowNull: false },
    created_at: { type: DataTypes.DATE, allowNull: false },
    updated_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('job_actuals', ['organisation_id', 'recorded_at']);
  await qi.addColumn('job_completions', 'finish_key', { type: DataTypes.STRING(100), allowNull: true });
  await qi.addColumn('company_settings', 'actuals_required', { type: DataTypes.JSONB, allowNull: false, defaultValue: [] });
  await qi.createTable('settings_changes', {
    id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
    organisation_id: { type: DataTypes.UUID, allowNull: false, references: { model: 'organisations', key: 'id' }, onDelete: 'CASCADE' },
    user_id: { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
    setting: { type: DataTypes.STRING(60), allowNull: false },
    old_value: { type: DataTypes.JSONB, allowNull: true },
    new_value: { type: DataTypes.JSONB, allowNull: true },
    note: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
    created_at: { type: DataTypes.DATE, allowNull: false },
  });
  await qi.addIndex('settings_changes', ['organisation_id', 'created_at']);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable('settings_changes');
  await qi.removeColumn('company_settings', 'actuals_required');
  await qi.removeColumn('job_completions', 'finish_key');
  await qi.dropTable('job_actuals');
};
