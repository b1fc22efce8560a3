import type { AppDeps } from '../../deps';

/** How long the database may take to answer `SELECT 1` before the instance reads as not ready. */
export const READY_DB_TIMEOUT_MS = 1000;

type Check = 'ok' | string;

export interface Readiness {
  ready: boolean;
  checks: { database: Check; mailQueue: Check; shutdown: Check };
  /** The names of the checks that are not 'ok'. */
  failing: string[];
}

/** Runs `SELECT 1` on the app's pool, given up after `ms` (a hung connection must not hang the probe). */
async function databaseCheck(deps: Pick<AppDeps, 'sequelize'>, ms: number): Promise<Check> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<Check>((resolve) => {
    timer = setTimeout(() => resolve(`no answer within ${ms} ms`), ms);
  });
  const query = deps.sequelize.query('SELECT 1').then(
    (): Check => 'ok',
    (err: Error): Check => `unavailable (${err.message.slice(0, 200)})`,
  );
  try {
    return await Promise.race([query, timeout]);
  } finally {
    clearTimeout(timer);
  }
}

/** The readiness of this instance: database answering, mail queue running, not shutting down. */
export async function checkReadiness(deps: Pick<AppDeps, 'sequelize' | 'mailQueue' | 'lifecycle'>, dbTimeoutMs = READY_DB_TIMEOUT_MS): Promise<Readiness> {
  const checks = {
    database: await databaseCheck(deps, dbTimeoutMs),
    mailQueue: deps.mailQueue.running() ? 'ok' : 'stopped',
    shutdown: deps.lifecycle.draining ? 'shutting down' : 'ok',
  };
  const failing = Object.entries(checks)
    .filter(([, v]) => v !== 'ok')
    .map(([k]) => k);
  return { ready: failing.length === 0, checks, failing };
}
