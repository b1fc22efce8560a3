import { DataTypes, type QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// The company's eaves mode for plans that do not choose one, and its hatch kit's insulation depth (see shared/api/settings.ts).
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.addColumn('company_settings', 'eaves_mode', { type: DataTypes.STRING(12), allowNull: false, defaultValue: 'gap' });
  await qi.addColumn('company_settings', 'hatch_kit_insulation_mm', { type: DataTypes.DOUBLE, allowNull: false, defaultValue: 0 });
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.removeColumn('company_settings', 'hatch_kit_insulation_mm');
  await qi.removeColumn('company_settings', 'eaves_mode');
};
