import pg from 'pg';
import type { QueryInterface, Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { MIGRATIONS } from './migrations';

// Any constant: several app instances starting together take turns on this lock.
const MIGRATION_LOCK_KEY = 4_217_301;

export function createUmzug(sequelize: Sequelize) {
  return new Umzug<QueryInterface>({
    migrations: MIGRATIONS,
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Runs pending migrations under a PostgreSQL advisory lock; returns the names applied. */
export async function runMigrations(sequelize: Sequelize, databaseUrl: string): Promise<string[]> {
  const lock = new pg.Client({ connectionString: databaseUrl });
  await lock.connect();
  try {
    await lock.query('SELECT pg_advisory_lock($1)', [MIGRATION_LOCK_KEY]);
    const applied = await createUmzug(sequelize).up();
    return applied.map((m) => m.name);
  } finally {
    await lock.query('SELECT pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY]).catch(() => undefined);
    await lock.end();
  }
}
