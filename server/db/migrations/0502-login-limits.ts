import type { QueryInterface } from 'sequelize';
import type { MigrationFn } from 'umzug';

// Sign-in failure counts and back-off blocks, shared by every app instance on this database: the
// table rate-limiter-flexible's PostgreSQL store uses (its own CREATE TABLE, made here once instead
// of by each instance at start-up). `expire` is epoch milliseconds.
export const up: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.sequelize.query(`CREATE TABLE login_limits (key varchar(255) PRIMARY KEY, points integer NOT NULL DEFAULT 0, expire bigint)`);
};

export const down: MigrationFn<QueryInterface> = async ({ context: qi }) => {
  await qi.dropTable('login_limits');
};
