// The plan read that brings its session along in one statement answers the ordinary signed-in read
// exactly as the plans service does, and leaves every other case to the usual session stack.
import fs from 'node:fs';
import path from 'node:path';
import { QueryTypes } from 'sequelize';
import request from 'supertest';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { User } from '../../server/db/models';
import { SESSION_MAX_AGE_MS } from '../../server/middleware/session';
import { planReadWithSession } from '../../server/modules/plans/plan-read-session';
import { createPlansService } from '../../server/modules/plans/plans.service';
import type { SessionUser } from '../../server/types';
import { planSchema } from '../../shared/plan/plan-schema';
import { createJob, createOrgWithUsers, createTestContext, type TestContext, type TestOrg, type TestUser } from '../helpers/test-app';

const plan = planSchema.parse(JSON.parse(fs.readFileSync(path.join(__dirname, '..', '..', 'examples', 'l-shape.json'), 'utf8')));

let ctx: TestContext;
let org: TestOrg;
let assigned: string;
let unassigned: string;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  assigned = (await createJob(org, { plan, assignedInstallerId: org.installer.id })).space.id;
  unassigned = (await createJob(org, { plan })).space.id;
});
afterAll(async () => {
  await ctx?.close();
});
afterEach(() => {
  vi.restoreAllMocks();
});

/** The session cookie from a sign-in. */
async function cookieOf(user: TestUser): Promise<string> {
  const res = await request(ctx.app).post('/api/auth/login').send({ email: user.email, password: user.password }).expect(200);
  return String(res.headers['set-cookie']).split(';')[0];
}

const sessionUser = (u: TestUser): SessionUser => ({
  id: u.id,
  email: u.email,
  name: u.name,
  role: u.role,
  organisationId: org.id,
  organisationName: org.name,
});

/** The names of the statements run on the pool while `fn` runs. */
async function statementsDuring(fn: () => Promise<unknown>): Promise<string[]> {
  const names: string[] = [];
  const query = ctx.deps.pool.query.bind(ctx.deps.pool);
  vi.spyOn(ctx.deps.pool, 'query').mockImplementation(((config: { name?: string }, ...rest: unknown[]) => {
    names.push(config?.name ?? '(unnamed)');
    return (query as (...a: unknown[]) => unknown)(config, ...rest);
  }) as never);
  await fn();
  vi.restoreAllMocks();
  return names;
}

describe('GET /api/spaces/:id/plan for an ordinary signed-in read', () => {
  it('answers in one statement, byte for byte what the plans service answers, to a writer and a viewer', async () => {
    const service = createPlansService(ctx.deps);
    for (const user of [org.office, org.installer]) {
      const cookie = await cookieOf(user);
      let text = '';
      const names = await statementsDuring(async () => {
        const res = await request(ctx.app).get(`/api/spaces/${assigned}/plan`).set('Cookie', cookie).expect(200);
        expect(res.headers['set-cookie']).toBeUndefined();
        text = res.text;
      });
      expect(names).toEqual(['plan-read-session-1']);
      expect(text).toBe(JSON.stringify(await service.get(sessionUser(user), assigned)));
    }
    // The viewer is sent the stored takeoff, the writer none.
    const viewer = JSON.parse(JSON.stringify(await service.get(sessionUser(org.installer), assigned)));
    expect(viewer.takeoff?.format).toMatch(/^quiltline-takeoff\//);
    expect((await service.get(sessionUser(org.office), assigned)).takeoff).toBeNull();
  });
});

describe('plan reads that arrive together', () => {
  it('share one statement, and each is answered for its own user or handed on', async () => {
    const handler = planReadWithSession(ctx.deps.pool, ctx.config.sessionSecret);
    const other = await createOrgWithUsers(ctx);
    const theirs = (await createJob(other, { plan })).space.id;
    const [office, installer] = [await cookieOf(org.office), await cookieOf(org.installer)];
    // Who asks for which space, and whether this read answers it (else the usual stack decides).
    const asks = [
      { cookie: office, space: assigned, user: org.office, answered: true },
      { cookie: installer, space: assigned, user: org.installer, answered: true },
      { cookie: installer, space: unassigned, user: org.installer, answered: false }, // not assigned to them
      { cookie: office, space: theirs, user: org.office, answered: false }, // another company's
      { cookie: office, space: unassigned, user: org.office, answered: true },
    ];
    let outcomes: { body?: unknown; handedOn?: boolean }[] = [];
    const names = await statementsDuring(async () => {
      // Called in one turn of the event loop, as requests read from several sockets at once are.
      outcomes = await Promise.all(
        asks.map(
          (a) =>
            new Promise<{ body?: unknown; handedOn?: boolean }>((resolve, reject) => {
              const req = { headers: { cookie: a.cookie }, params: { id: a.space } };
              const res = { json: (body: unknown) => resolve({ body }) };
              handler(req as never, res as never, (err?: unknown) => (err ? reject(err) : resolve({ handedOn: true })));
            }),
        ),
      );
    });
    expect(names).toEqual([`plan-read-session-${asks.length}`]);
    const service = createPlansService(ctx.deps);
    for (const [k, a] of asks.entries()) {
      if (!a.answered) expect(outcomes[k], `read ${k}`).toEqual({ handedOn: true });
      else expect(JSON.stringify(outcomes[k].body), `read ${k}`).toBe(JSON.stringify(await service.get(sessionUser(a.user), a.space)));
    }
  });
});

describe('GET /api/spaces/:id/plan outside the ordinary case', () => {
  it('refuses a missing or forged cookie, and a malformed id, as the usual stack does', async () => {
    const cookie = await cookieOf(org.estimator);
    await request(ctx.app).get(`/api/spaces/${assigned}/plan`).expect(401);
    const forged = cookie.replace(/.(;|$)/, (c) => (c[0] === 'A' ? 'B' : 'A') + c.slice(1));
    expect(forged).not.toBe(cookie);
    await request(ctx.app).get(`/api/spaces/${assigned}/plan`).set('Cookie', forged).expect(401);
    const bad = await request(ctx.app).get('/api/spaces/not-a-uuid/plan').set('Cookie', cookie).expect(422);
    expect(bad.body.error.code).toBe('validation_failed');
  });

  it('answers 404 for a space the installer may not see and one of another company', async () => {
    const cookie = await cookieOf(org.installer);
    await request(ctx.app).get(`/api/spaces/${unassigned}/plan`).set('Cookie', cookie).expect(404);
    const other = await createOrgWithUsers(ctx);
    const theirs = (await createJob(other, { plan })).space.id;
    await request(ctx.app)
      .get(`/api/spaces/${theirs}/plan`)
      .set('Cookie', await cookieOf(org.office))
      .expect(404);
  });

  it('pushes an older session’s expiry forward, as any other request does', async () => {
    const cookie = await cookieOf(org.office);
    const sid = decodeURIComponent(cookie.split('=')[1]).slice(2).split('.')[0];
    const expires = new Date(Date.now() + SESSION_MAX_AGE_MS - 2 * 24 * 3600_000);
    await ctx.deps.sequelize.query(
      `UPDATE "session" SET expire = $2, sess = jsonb_set(sess::jsonb, '{cookie,expires}', to_jsonb($3::text))::json WHERE sid = $1`,
      { bind: [sid, expires, expires.toISOString()] },
    );
    const res = await request(ctx.app).get(`/api/spaces/${assigned}/plan`).set('Cookie', cookie).expect(200);
    expect(String(res.headers['set-cookie'])).toContain('quiltline.sid=');
    const [row] = await ctx.deps.sequelize.query<{ expire: Date }>(`SELECT expire FROM "session" WHERE sid = $1`, { bind: [sid], type: QueryTypes.SELECT });
    expect(row.expire.getTime()).toBeGreaterThan(Date.now() + SESSION_MAX_AGE_MS - 3600_000);
  });

  it('signs a deactivated user out on the very next read', async () => {
    const other = await createOrgWithUsers(ctx);
    const space = (await createJob(other, { plan })).space.id;
    const cookie = await cookieOf(other.estimator);
    await request(ctx.app).get(`/api/spaces/${space}/plan`).set('Cookie', cookie).expect(200);
    await User.update({ active: false }, { where: { id: other.estimator.id } });
    await request(ctx.app).get(`/api/spaces/${space}/plan`).set('Cookie', cookie).expect(401);
  });
});
