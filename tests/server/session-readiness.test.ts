// Sessions read their user in the same query and are not rewritten per request; readiness checks.
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { User } from '../../server/db/models';
import { SESSION_MAX_AGE_MS } from '../../server/middleware/session';
import { createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => {
  await ctx?.close();
});

async function sessionRowsOf(userId: string) {
  return ctx.deps.sequelize.query<{ sid: string; expire: Date; sess: { cookie: { expires: string } } }>(
    `SELECT sid, expire, sess FROM "session" WHERE sess->'passport'->>'user' = $1`,
    { bind: [userId], type: QueryTypes.SELECT },
  );
}

describe('signed-in requests', () => {
  it('do not rewrite the session row or send the cookie again on every request', async () => {
    const agent = await loginAs(ctx.app, org.estimator);
    const [before] = await sessionRowsOf(org.estimator.id);
    for (let i = 0; i < 3; i++) {
      const res = await agent.get('/api/auth/me');
      expect(res.status).toBe(200);
      expect(res.headers['set-cookie']).toBeUndefined();
    }
    const [after] = await sessionRowsOf(org.estimator.id);
    expect(after.expire.getTime()).toBe(before.expire.getTime());
  });

  it('push an older session’s expiry forward to the full age, once', async () => {
    const agent = await loginAs(ctx.app, org.office);
    const [row] = await sessionRowsOf(org.office.id);
    // As if signed in two days ago: five of the seven days left.
    const expires = new Date(Date.now() + SESSION_MAX_AGE_MS - 2 * 24 * 3600_000);
    await ctx.deps.sequelize.query(
      `UPDATE "session" SET expire = $2, sess = jsonb_set(sess::jsonb, '{cookie,expires}', to_jsonb($3::text))::json WHERE sid = $1`,
      { bind: [row.sid, expires, expires.toISOString()] },
    );
    const refreshed = await agent.get('/api/auth/me');
    expect(refreshed.status).toBe(200);
    expect(String(refreshed.headers['set-cookie'])).toContain('quiltline.sid=');
    const [moved] = await sessionRowsOf(org.office.id);
    expect(moved.expire.getTime()).toBeGreaterThan(Date.now() + SESSION_MAX_AGE_MS - 3600_000);
    // The user read with the session is never stored in the row.
    expect(JSON.stringify(moved.sess)).not.toContain('loadedUser');
    const next = await agent.get('/api/auth/me');
    expect(next.headers['set-cookie']).toBeUndefined();
  });

  it('see a role change and a deactivation on the very next request', async () => {
    const other = await createOrgWithUsers(ctx);
    const agent = await loginAs(ctx.app, other.estimator);
    expect((await agent.get('/api/auth/me')).body.user.role).toBe('estimator');
    await User.update({ role: 'installer' }, { where: { id: other.estimator.id } });
    expect((await agent.get('/api/auth/me')).body.user.role).toBe('installer');
    // Even without its session rows deleted, an inactive user is signed out at once.
    await User.update({ active: false }, { where: { id: other.estimator.id } });
    expect((await agent.get('/api/auth/me')).status).toBe(401);
    expect((await agent.get('/api/jobs')).status).toBe(401);
  });
});

describe('GET /api/ready', () => {
  it('answers 200 with every check ok, and /api/health stays liveness', async () => {
    const res = await request(ctx.app).get('/api/ready');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ready: true, checks: { database: 'ok', mailQueue: 'ok', shutdown: 'ok' }, failing: [] });
    expect((await request(ctx.app).get('/api/health')).status).toBe(200);
  });

  it('answers 503 naming the shutdown while the instance drains', async () => {
    ctx.deps.lifecycle.draining = true;
    try {
      const res = await request(ctx.app).get('/api/ready');
      expect(res.status).toBe(503);
      expect(res.body.failing).toEqual(['shutdown']);
      expect(res.headers.connection).toBe('close');
      expect((await request(ctx.app).get('/api/health')).status).toBe(200);
    } finally {
      ctx.deps.lifecycle.draining = false;
    }
  });

  it('answers 503 naming the database when it does not answer in time', async () => {
    const { checkReadiness } = await import('../../server/modules/health/readiness');
    const hung = { ...ctx.deps, sequelize: { query: () => new Promise(() => undefined) } as never };
    const report = await checkReadiness(hung, 50);
    expect(report.ready).toBe(false);
    expect(report.failing).toEqual(['database']);
    expect(report.checks.database).toMatch(/no answer within 50 ms/);
  });

  it('answers 503 naming the mail queue once it is stopped', async () => {
    const own = await createTestContext();
    try {
      await own.deps.mailQueue.stop();
      const res = await request(own.app).get('/api/ready');
      expect(res.status).toBe(503);
      expect(res.body.failing).toEqual(['mailQueue']);
      expect(res.body.checks.mailQueue).toBe('stopped');
    } finally {
      await own.close();
    }
  });
});
