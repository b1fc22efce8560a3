import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// A removed space is kept with its revisions (deleted_at set) so the removal can be undone.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('spaces', 'deleted_at', { type: DataTypes.DATE, allowNull: true });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeColumn('spaces', 'deleted_at');
};
