import type { QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// A change that records several timeline events (a job assigned and scheduled in one save) writes
// them within the same millisecond, so their times tie and an order by time alone may come back
// either way. An identity column numbers the events as they are inserted: the tie-breaker.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE job_events ADD COLUMN IF NOT EXISTS seq bigint GENERATED ALWAYS AS IDENTITY');
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('ALTER TABLE job_events DROP COLUMN IF EXISTS seq');
};
