// vitest globalSetup: one fresh PostgreSQL database per test run on the project cluster.
import type { TestProject } from 'vitest/node';
import { databaseUrl, dropDatabase, ensureDatabase, ensurePgRunning, psql, stopPg } from '../../scripts/pg.mjs';
import { runMigrations } from '../../server/db/migrate';
import { createSequelize } from '../../server/db/sequelize';

declare module 'vitest' {
  export interface ProvidedContext {
    /** postgres:// URL of this run's first freshly migrated database. */
    databaseUrl: string;
    /** One freshly migrated database per test worker (VITEST_POOL_ID 1..n picks one). */
    databaseUrls: string[];
  }
}

const PREFIX = 'quiltline_test_';

function pidAlive(pid: number) {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

export default async function setup(project: TestProject) {
  const started = Date.now();
  const { cfg, startedHere } = await ensurePgRunning();
  const opts = { cfg };

  // Databases left by runs that crashed (their process is gone) are dropped; live runs are left alone.
  for (const name of psql(`SELECT datname FROM pg_database WHERE datname LIKE '${PREFIX}%'`, opts).split('\n').filter(Boolean)) {
    const pid = Number(name.split('_').pop());
    if (!pidAlive(pid)) dropDatabase(name, opts);
  }

  // One database per worker: files in one worker run one after another, so each database sees
  // one file at a time, as if the run were serial.
  const workers = Math.max(1, Number(process.env.QUILTLINE_TEST_WORKERS ?? 2));
  const stamp = Date.now();
  const dbNames = Array.from({ length: workers }, (_, i) => `${PREFIX}${stamp}_w${i + 1}_${process.pid}`);
  const urls = await Promise.all(
    dbNames.map(async (dbName) => {
      ensureDatabase(dbName, opts);
      const url = databaseUrl(dbName, cfg);
      const sequelize = createSequelize(url);
      try {
        await runMigrations(sequelize, url);
      } finally {
        await sequelize.close();
      }
      return url;
    }),
  );
  process.env.TEST_DATABASE_URL = urls[0];
  project.provide('databaseUrl', urls[0]);
  project.provide('databaseUrls', urls);
  console.log(`[tests] ${workers} database(s) on 127.0.0.1:${cfg.port} ready in ${Date.now() - started} ms`);

  return async () => {
    if (process.env.KEEP_TEST_DB !== '1') for (const dbName of dbNames) dropDatabase(dbName, opts);
    // Stop the cluster only if this run started it and no other run or server is using it.
    if (!startedHere) return;
    const others = psql(`SELECT count(*) FROM pg_database WHERE datname LIKE '${PREFIX}%'`, opts);
    const clients = psql(`SELECT count(*) FROM pg_stat_activity WHERE backend_type = 'client backend' AND pid <> pg_backend_pid()`, opts);
    if (others === '0' && clients === '0') stopPg(cfg);
  };
}
