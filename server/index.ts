import './types';
import { createApp } from './app';
import { loadConfig } from './config';
import { runMigrations } from './db/migrate';
import { seedDemo } from './db/seeders/demo';
import { seedQuotesDemo } from './db/seeders/quotes-demo';
import { createDeps } from './deps';
import { backfillStoredTakeoffs } from './modules/plan-revisions/plan-takeoff';

/** Boots the API: config → deps → migrations → demo seed → listen. Listening only; the app is in app.ts. */
async function main() {
  let config;
  try {
    config = loadConfig();
  } catch (e) {
    console.error((e as Error).message);
    process.exit(1);
  }
  const deps = await createDeps(config);
  if (config.migrateOnStart) {
    const applied = await runMigrations(deps.sequelize, config.databaseUrl);
    if (applied.length) console.log(`[server] migrations applied: ${applied.join(', ')}`);
  }
  if (config.seedDemo) {
    const seeded = await seedDemo(deps);
    if (seeded) console.log('[server] demo data created (sign in as office@demo.example.com / quiltline-demo)');
    await seedQuotesDemo(); // demo company details, catalogue prices, tax rates (idempotent)
  }
  // Revisions stored without a takeoff of the current format (older data, a format bump) get one.
  const backfill = await backfillStoredTakeoffs((line) => console.warn(`[server] ${line}`));
  if (backfill.updated || backfill.failed) console.log(`[server] takeoffs backfilled: ${backfill.updated} updated, ${backfill.failed} could not be worked out`);
  const app = createApp(deps);
  const server = app.listen(config.port, config.host, () => {
    console.log(`[server] Quiltline listening on http://${config.host}:${config.port}`);
    if (deps.outbox) console.log('[server] e-mail goes to the local fake SMTP server (Outbox page, office users)');
  });
  server.on('error', (err) => {
    console.error(`[server] cannot listen on ${config.host}:${config.port}: ${err.message}`);
    process.exit(1);
  });

  let stopping = false;
  const stop = (signal: string) => {
    if (stopping) return;
    stopping = true;
    console.log(`[server] ${signal}: closing`);
    server.closeAllConnections?.();
    server.close(() => {
      deps.close().finally(() => process.exit(0));
    });
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.on('SIGINT', () => stop('SIGINT'));
  process.on('SIGTERM', () => stop('SIGTERM'));
}

main().catch((e) => {
  console.error('[server] failed to start:', e);
  process.exit(1);
});
