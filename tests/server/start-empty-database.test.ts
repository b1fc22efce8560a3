// The real server started on a database with nothing in it, as on a first deploy: it migrates,
// comes up, and answers liveness and readiness, with and without the demo data. Every start-up
// step that reads tables (the takeoff backfill, the mail sweep, the demo seed) has to run after the
// migrations; a sweep placed before them once only logged a warning, and nothing here noticed.
import pg from 'pg';
import { afterAll, describe, expect, it } from 'vitest';
import { MIGRATIONS } from '../../server/db/migrations';
import { DEMO_PASSWORD } from '../../server/db/seeders/demo';
import { databaseUrl, dropDatabase, ensureDatabase } from '../../scripts/pg.mjs';
import { startAppProcess, until, type AppProcess } from '../helpers/app-process';

const started: AppProcess[] = [];
const databases: string[] = [];

afterAll(async () => {
  await Promise.all(started.map((app) => app.stop('SIGKILL')));
  for (const db of databases) dropDatabase(db);
});

/** The log lines the process wrote so far, parsed (pino's JSON; anything else is left out). */
function logLines(app: AppProcess): Array<{ level: number; msg: string }> {
  return app
    .output()
    .split('\n')
    .filter((l) => l.startsWith('{'))
    .map((l) => JSON.parse(l) as { level: number; msg: string });
}

async function signIn(url: string, email: string, password: string) {
  return fetch(`${url}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  });
}

describe('start-up on an empty database', () => {
  it.each([{ demo: false }, { demo: true }])('migrates, comes up and is ready (demo data: $demo)', { timeout: 240_000 }, async ({ demo }) => {
    // Arrange: a database with no tables at all.
    const db = `quiltline_empty_start_${demo ? 'demo' : 'plain'}_${process.pid}`;
    databases.push(db);
    dropDatabase(db);
    ensureDatabase(db);
    const url = databaseUrl(db);

    // Act: the server as production starts it (migrations on start), resolving once /api/health is 200.
    const app = await startAppProcess(`empty-${demo ? 'demo' : 'plain'}`, {
      DATABASE_URL: url,
      SEED_DEMO: demo ? '1' : '0',
      LOG_LEVEL: 'info',
      TAKEOFF_WORKERS: '1',
    });
    started.push(app);

    // Assert: ready (database and mail queue), the whole schema in place, no warning or error
    // logged on the way up.
    await until('readiness 200', 60_000, async () => ((await fetch(`${app.url}/api/ready`)).status === 200 ? true : undefined));
    const client = new pg.Client({ connectionString: url });
    await client.connect();
    try {
      const { rows } = await client.query<{ n: number }>('SELECT count(*)::int AS n FROM schema_migrations');
      expect(rows[0].n).toBe(MIGRATIONS.length);
    } finally {
      await client.end();
    }
    await until('the listening line in the log', 30_000, async () => (logLines(app).some((l) => l.msg.startsWith('Quiltline listening')) ? true : undefined));
    expect(
      logLines(app).filter((l) => l.level >= 40),
      app.output(),
    ).toEqual([]);
    // The tables the API reads are there: a sign-in is answered (401 without demo data, 200 with).
    const login = await signIn(app.url, 'office@demo.example.com', DEMO_PASSWORD);
    expect(login.status).toBe(demo ? 200 : 401);
    if (demo) {
      const cookie = login.headers
        .getSetCookie()
        .map((c) => c.split(';')[0])
        .join('; ');
      const jobs = await fetch(`${app.url}/api/jobs`, { headers: { cookie } });
      expect(jobs.status).toBe(200);
      expect(((await jobs.json()) as { count: number }).count).toBeGreaterThan(0);
    }
  });
});
