import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// The company's minimum usable offcut length for the roll plan, mm (see shared/api/settings.ts).
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('company_settings', 'min_offcut_mm', { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 500 });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeColumn('company_settings', 'min_offcut_mm');
};
