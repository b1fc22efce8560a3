// PostgreSQL going away under a running app: every backend of the app's database is terminated
// (pg_terminate_backend, as a restart does) and new connections are refused for a while
// (ALLOW_CONNECTIONS false). The process must survive, answer 503 with Retry-After meanwhile (the
// pay page says so in words), and recover by itself, sessions intact, once connections are allowed.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { psql } from '../../scripts/pg.mjs';
import { createOrgWithUsers, createTestContext, loginAs, testDatabaseUrl, type TestContext } from '../helpers/test-app';

let ctx: TestContext;
const dbName = () => new URL(testDatabaseUrl()).pathname.slice(1);
const allowConnections = (allow: boolean) => psql(`ALTER DATABASE "${dbName()}" ALLOW_CONNECTIONS ${allow}`);
const terminateBackends = () => psql(`SELECT count(pg_terminate_backend(pid)) FROM pg_stat_activity WHERE datname = '${dbName()}' AND pid <> pg_backend_pid()`);

beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  allowConnections(true);
  await ctx?.close();
});

describe('a database restart', () => {
  it('answers 503 with Retry-After while the database is away, never kills the process, and recovers by itself', async () => {
    const org = await createOrgWithUsers(ctx);
    const office = await loginAs(ctx.app, org.office);
    // Both pools hold connections now (the session store's and Sequelize's).
    expect((await office.get('/api/jobs')).status).toBe(200);
    // Nothing of the test's own listens on the pools: an unheard 'error' would end this process.
    const idleBefore = ctx.deps.pool.idleCount;
    expect(idleBefore).toBeGreaterThan(0);

    allowConnections(false);
    try {
      expect(Number(terminateBackends())).toBeGreaterThan(0);
      // The idle session-store client hears its server go and is dropped (that 'error' used to end the process).
      await expect.poll(() => ctx.deps.pool.idleCount, { timeout: 10_000 }).toBeLessThan(idleBefore);

      for (const path of ['/api/auth/me', '/api/jobs']) {
        const res = await office.get(path);
        expect(res.status, path).toBe(503);
        expect(res.headers['retry-after']).toMatch(/^\d+$/);
        expect(res.body.error.code).toBe('service_unavailable');
      }
      const pay = await request(ctx.app).get('/pay/invoice/some-customer-token');
      expect(pay.status).toBe(503);
      expect(pay.headers['retry-after']).toMatch(/^\d+$/);
      expect(pay.text).toContain('briefly unavailable');
      expect(pay.text).not.toContain('Link not recognised');
    } finally {
      allowConnections(true);
    }

    // Back by itself: the same session cookie works again, no restart of the app.
    await expect.poll(async () => (await office.get('/api/auth/me')).status, { timeout: 20_000 }).toBe(200);
    expect((await office.get('/api/jobs')).status).toBe(200);
    expect((await request(ctx.app).get('/pay/invoice/some-customer-token')).status).toBe(404);
  });
});
