import { loadConfig } from './config';
import { runMigrations } from './db/migrate';
import { createSequelize } from './db/sequelize';
import { createLogger } from './lib/logger';

/**
 * `npm run migrate` (or `node dist-server/migrate.js`): applies pending migrations once, for a
 * deploy step; instances then start with MIGRATE_ON_START=0. Takes the same advisory lock as start-up.
 */
async function main() {
  const config = loadConfig();
  const log = createLogger({ level: config.logLevel });
  const sequelize = createSequelize(config.databaseUrl);
  try {
    const applied = await runMigrations(sequelize, config.databaseUrl);
    log.info({ migrations: applied }, applied.length ? 'migrations applied' : 'no pending migrations');
  } finally {
    await sequelize.close();
  }
}

main().catch((e: unknown) => {
  createLogger().fatal({ err: e }, 'migrations failed');
  process.exit(1);
});
