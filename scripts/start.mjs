#!/usr/bin/env node
// `npm start`: install npm packages if node_modules is missing, build the client (dist/) and
// compile the server (dist-server/) if needed, start the project PostgreSQL (unless DATABASE_URL is
// set), then the API server with plain node, which runs migrations, seeds the demo data once,
// starts the fake SMTP server (unless SMTP_URL is set) and serves dist/ + /api on PORT (default 3000).
// `npm run dev` (--dev): the API from source under `tsx watch` plus the Vite dev server with its /api proxy.
// Ctrl-C / SIGTERM stops the server, then the cluster (if this script started it).
import { spawn, spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';
import { buildClient } from './client-build.mjs';
import { buildServer } from './server-build.mjs';
import { APP_DB, REPO_ROOT, databaseUrl, ensureDatabase, ensurePgRunning, psql, stopPg } from './pg.mjs';

const dev = process.argv.includes('--dev');

function pidAlive(pid) {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return e.code === 'EPERM';
  }
}
const log = (m) => process.stderr.write(`[start] ${m}\n`);
const bin = (name) => path.join(REPO_ROOT, 'node_modules', '.bin', name);

async function main() {
  if (!fs.existsSync(path.join(REPO_ROOT, 'node_modules'))) {
    log('node_modules is missing: npm install');
    const r = spawnSync('npm', ['install'], { cwd: REPO_ROOT, stdio: 'inherit' });
    if (r.status !== 0) throw new Error('npm install failed');
  }
  const port = Number(process.env.PORT ?? 3000);
  // Compiled server: only the runtime dependencies are loaded (tsx and esbuild are dev tools).
  let serverMain = null;
  if (!dev) {
    buildClient();
    serverMain = await buildServer({ log });
  }

  let pg = null;
  const env = { ...process.env };
  if (!env.DATABASE_URL) {
    pg = await ensurePgRunning();
    ensureDatabase(APP_DB, { cfg: pg.cfg });
    env.DATABASE_URL = databaseUrl(APP_DB, pg.cfg);
    log(`PostgreSQL on 127.0.0.1:${pg.cfg.port}, data in ${pg.cfg.dataDir}${pg.startedHere ? '' : ' (already running; left running on exit)'}`);
  } else {
    log('using DATABASE_URL (no local cluster started)');
  }

  const children = [];
  const apiPort = dev ? Number(process.env.API_PORT ?? port + 1) : port;
  // node or tsx directly (not npx) so signals reach the server process.
  const [serverCmd, serverArgs] = dev
    ? [bin('tsx'), ['watch', '--clear-screen=false', 'server/index.ts']]
    : [process.execPath, ['--enable-source-maps', serverMain]];
  // Without real keys the app's SDK talks to the local stand-in started below.
  if (!env.STRIPE_SECRET_KEY && !env.PAYMENTS_API_URL) env.PAYMENTS_API_URL = `http://127.0.0.1:${env.FAKE_PAYMENTS_PORT ?? 12111}`;
  const server = spawn(serverCmd, serverArgs, { cwd: REPO_ROOT, stdio: 'inherit', env: { ...env, PORT: String(apiPort) } });
  children.push(server);
  // With no real payment keys, the local checkout stand-in (no money moves).
  if (!env.STRIPE_SECRET_KEY) {
    const [paymentsCmd, paymentsArgs] = dev
      ? [bin('tsx'), ['scripts/fake-payments.ts']]
      : [process.execPath, [path.join(REPO_ROOT, 'dist-server', 'fake-payments.js')]];
    const payments = spawn(paymentsCmd, paymentsArgs, {
      cwd: REPO_ROOT,
      stdio: 'inherit',
      env: { ...env, PAYMENTS_WEBHOOK_URL: `http://127.0.0.1:${apiPort}/api/payments/webhook` },
    });
    children.push(payments);
    payments.isPaymentsStandIn = true;
  }
  if (dev) {
    const vite = spawn(bin('vite'), ['--port', String(process.env.VITE_PORT ?? 5173), '--strictPort'], {
      cwd: REPO_ROOT,
      stdio: 'inherit',
      env: { ...env, API_PORT: String(apiPort) },
    });
    children.push(vite);
    log(`dev: open http://127.0.0.1:${process.env.VITE_PORT ?? 5173} (Vite, reloads on change); API on :${apiPort}`);
  }

  let stopping = false;
  const shutdown = async (code) => {
    if (stopping) return;
    stopping = true;
    await Promise.all(
      children.map(
        (c) =>
          new Promise((resolve) => {
            if (c.exitCode !== null || c.signalCode !== null) return resolve();
            c.once('exit', resolve);
            c.kill('SIGTERM');
            setTimeout(() => c.kill('SIGKILL'), 8000).unref();
          }),
      ),
    );
    if (pg?.startedHere) {
      try {
        // A test run that found the cluster running uses it too: leave it to that run.
        const testRuns = psql("SELECT datname FROM pg_database WHERE datname LIKE 'quiltline_test_%'", { cfg: pg.cfg })
          .split('\n')
          .filter((name) => name && pidAlive(Number(name.split('_').pop())));
        if (testRuns.length > 0) log('PostgreSQL left running: a test run is using it (node scripts/pg.mjs stop)');
        else stopPg(pg.cfg);
      } catch (e) {
        log(e.message);
      }
    }
    process.exit(code);
  };
  process.on('SIGINT', () => shutdown(0));
  process.on('SIGTERM', () => shutdown(0));
  for (const c of children) {
    c.on('exit', (code, signal) => {
      if (stopping) return;
      // The app runs without the payments stand-in (card payment pages then say the service is unreachable).
      if (c.isPaymentsStandIn) return log(`payments stand-in exited (${signal ?? code}); the app keeps running`);
      log(`${c === server ? 'server' : 'vite'} exited (${signal ?? code}); shutting down`);
      shutdown(code ?? 1);
    });
  }
}

main().catch((e) => {
  log(e.message);
  process.exit(1);
});
