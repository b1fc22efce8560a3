import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// Actuals can be corrected after finishing: a version that each correction must name (so two
// corrections at once cannot lose one), and who corrected them last and when (the job's history
// keeps every change with its before and after).
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('job_actuals', 'version', { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 });
  await qi.addColumn('job_actuals', 'edited_by_id', { type: DataTypes.UUID, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' });
  await qi.addColumn('job_actuals', 'edited_at', { type: DataTypes.DATE, allowNull: true });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeColumn('job_actuals', 'edited_at');
  await qi.removeColumn('job_actuals', 'edited_by_id');
  await qi.removeColumn('job_actuals', 'version');
};
