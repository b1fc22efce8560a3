import type { QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// Every instance looks for waiting messages left without a queue job (mail-queue.ts, failOrphans)
// every few minutes; sent mail piles up, waiting mail stays a handful: index only those.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`CREATE INDEX IF NOT EXISTS mail_messages_waiting ON mail_messages (id) WHERE status = 'waiting'`);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query('DROP INDEX IF EXISTS mail_messages_waiting');
};
