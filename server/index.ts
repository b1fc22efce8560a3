import './types';
import { createApp } from './app';
import { loadConfig } from './config';
import { runMigrations } from './db/migrate';
import { seedDemo } from './db/seeders/demo';
import { seedQuotesDemo } from './db/seeders/quotes-demo';
import { createDeps } from './deps';
import { createLogger } from './lib/logger';
import { createShutdown } from './lib/shutdown';
import { backfillStoredTakeoffs } from './modules/plan-revisions/plan-takeoff';

/** Boots the API: config → deps → migrations → demo seed → listen. Listening only; the app is in app.ts. */
async function main() {
  let config;
  try {
    config = loadConfig();
  } catch (e) {
    createLogger().fatal((e as Error).message);
    process.exit(1);
  }
  const deps = await createDeps(config);
  const log = deps.logger;
  // A stop asked for while starting (migrations, demo data, backfill) ends the process through
  // process.exit, so the batched log is written out; the shutdown below takes over once listening.
  const stopWhileStarting = (signal: NodeJS.Signals) => {
    log.info(`${signal} while starting: stopped`);
    process.exit(signal === 'SIGINT' ? 130 : 143);
  };
  process.once('SIGINT', stopWhileStarting);
  process.once('SIGTERM', stopWhileStarting);
  if (config.migrateOnStart) {
    const applied = await runMigrations(deps.sequelize, config.databaseUrl);
    if (applied.length) log.info({ migrations: applied }, 'migrations applied');
  }
  if (config.seedDemo) {
    const seeded = await seedDemo(deps);
    if (seeded) log.info('demo data created (sign in as office@demo.example.com / quiltline-demo)');
    await seedQuotesDemo(); // demo company details, catalogue prices, tax rates (idempotent)
  }
  // Revisions stored without a takeoff of the current format (older data, a format bump) get one.
  const backfill = await backfillStoredTakeoffs((line) => log.warn(line));
  if (backfill.updated || backfill.failed) log.info({ updated: backfill.updated, failed: backfill.failed }, 'takeoffs backfilled');
  // E-mail whose last try an earlier stop cut off is shown failed now, not after the first interval.
  await deps.mailQueue.failOrphans().catch((e: unknown) => log.warn(`mail: orphan sweep failed (${(e as Error).message})`));
  const app = createApp(deps);
  const server = app.listen(config.port, config.host, () => {
    log.info(`Quiltline listening on http://${config.host}:${config.port}`);
    if (deps.outbox) log.info('e-mail goes to the local fake SMTP server (Outbox page, office users)');
  });
  server.on('error', (err) => {
    log.fatal(`cannot listen on ${config.host}:${config.port}: ${err.message}`);
    process.exit(1);
  });

  const shutdown = createShutdown({
    server,
    deps,
    graceMs: config.shutdownGraceMs,
    timeoutMs: config.shutdownTimeoutMs,
    exit: (code) => process.exit(code),
  });
  process.off('SIGINT', stopWhileStarting);
  process.off('SIGTERM', stopWhileStarting);
  process.on('SIGINT', () => void shutdown.stop('SIGINT'));
  process.on('SIGTERM', () => void shutdown.stop('SIGTERM'));
}

main().catch((e) => {
  createLogger().fatal({ err: e }, 'failed to start');
  process.exit(1);
});
