import type { QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// The editor's plan read asks only which format a revision's stored takeoff has. Read from the
// takeoff itself, that fetches and unpacks its whole TOASTed document (~13 kB compressed, ~50 kB of
// JSON for a demo loft) on every read, a third of the statement's time. A stored generated column
// keeps the format beside the row: PostgreSQL computes it whenever the takeoff is written, so it
// cannot disagree with it. Adding it rewrites the table once.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`ALTER TABLE plan_revisions ADD COLUMN IF NOT EXISTS takeoff_format text GENERATED ALWAYS AS (takeoff->>'format') STORED`);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE plan_revisions DROP COLUMN IF EXISTS takeoff_format');
};
