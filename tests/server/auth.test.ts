import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createOrgWithUsers, createTestContext, createUser, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => ctx?.close());

describe('sign-in', () => {
  it('signs in with the right password and returns the user with their company', async () => {
    const res = await request(ctx.app).post('/api/auth/login').send({ email: org.estimator.email, password: org.estimator.password });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: org.estimator.id, email: org.estimator.email, role: 'estimator', organisation: { id: org.id, name: org.name } });
    expect(res.body.user).not.toHaveProperty('passwordHash');
  });

  it('sets an httpOnly, SameSite=Lax session cookie (not Secure over plain HTTP)', async () => {
    const res = await request(ctx.app).post('/api/auth/login').send({ email: org.office.email, password: org.office.password });
    const cookie = String(res.headers['set-cookie']?.[0] ?? '');
    expect(cookie).toMatch(/^quiltline\.sid=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/;\s*Secure/i);
  });

  it('marks the cookie Secure when a trusted proxy says the request came over HTTPS', async () => {
    const behindProxy = await createTestContext({ TRUST_PROXY: '1' });
    try {
      const res = await request(behindProxy.app)
        .post('/api/auth/login')
        .set('X-Forwarded-Proto', 'https')
        .send({ email: org.office.email, password: org.office.password });
      expect(res.status).toBe(200);
      expect(String(res.headers['set-cookie']?.[0])).toMatch(/;\s*Secure/i);
    } finally {
      await behindProxy.close();
    }
  });

  it('accepts the e-mail in any letter case', async () => {
    const res = await request(ctx.app).post('/api/auth/login').send({ email: org.office.email.toUpperCase(), password: org.office.password });
    expect(res.status).toBe(200);
  });

  it('refuses a wrong password with 401 JSON and no cookie', async () => {
    const res = await request(ctx.app).post('/api/auth/login').send({ email: org.office.email, password: 'not-the-password' });
    expect(res.status).toBe(401);
    expect(res.body).toEqual({ error: { code: 'invalid_credentials', message: expect.any(String) } });
    expect(res.headers['set-cookie']).toBeUndefined();
  });

  it('refuses an unknown e-mail exactly like a wrong password', async () => {
    const res = await request(ctx.app).post('/api/auth/login').send({ email: 'nobody-here@test.example.com', password: 'whatever-password' });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('invalid_credentials');
  });

  it('names the field when the body is invalid', async () => {
    const res = await request(ctx.app).post('/api/auth/login').send({ email: 'not-an-email', password: '' });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    const paths = res.body.error.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('answers malformed JSON with 400 JSON', async () => {
    const res = await request(ctx.app).post('/api/auth/login').set('content-type', 'application/json').send('{"email": ');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
  });

  it('refuses a user who has not set a password yet', async () => {
    const invited = await createUser(org.id, 'estimator', { password: null });
    const res = await request(ctx.app).post('/api/auth/login').send({ email: invited.email, password: 'anything-at-all' });
    expect(res.status).toBe(401);
  });

  it('limits repeated sign-in attempts for one address (429)', async () => {
    const limited = await createTestContext({ LOGIN_RATE_LIMIT: '3' });
    // An account of its own: the count is shared by every instance on the database, this file's other app too.
    const target = await createUser(org.id, 'installer');
    try {
      const attempt = () => request(limited.app).post('/api/auth/login').send({ email: target.email, password: 'wrong-password-x' });
      for (let i = 0; i < 3; i++) expect((await attempt()).status).toBe(401);
      const blocked = await attempt();
      expect(blocked.status).toBe(429);
      expect(blocked.body.error.code).toBe('rate_limited');
    } finally {
      await limited.close();
    }
  });
});

describe('session', () => {
  it('keeps the user signed in across requests', async () => {
    const agent = await loginAs(ctx.app, org.installer);
    const me1 = await agent.get('/api/auth/me');
    const me2 = await agent.get('/api/auth/me');
    expect(me1.status).toBe(200);
    expect(me2.body.user.id).toBe(org.installer.id);
  });

  it('gives a new session id at sign-in and retires the old one (no session fixation)', async () => {
    const sidOf = (r: request.Response) => String(r.headers['set-cookie']?.[0]).split(';')[0];
    const first = await request(ctx.app).post('/api/auth/login').send({ email: org.office.email, password: org.office.password });
    const cookie1 = sidOf(first);
    expect((await request(ctx.app).get('/api/auth/me').set('Cookie', cookie1)).status).toBe(200);
    // signing in again while holding that cookie
    const second = await request(ctx.app).post('/api/auth/login').set('Cookie', cookie1).send({ email: org.estimator.email, password: org.estimator.password });
    const cookie2 = sidOf(second);
    expect(cookie2).toMatch(/^quiltline\.sid=/);
    expect(cookie2).not.toBe(cookie1);
    expect((await request(ctx.app).get('/api/auth/me').set('Cookie', cookie2)).body.user.id).toBe(org.estimator.id);
    expect((await request(ctx.app).get('/api/auth/me').set('Cookie', cookie1)).status).toBe(401);
  });

  it('signs out: the same cookie no longer works', async () => {
    const agent = await loginAs(ctx.app, org.estimator);
    expect((await agent.get('/api/auth/me')).status).toBe(200);
    expect((await agent.post('/api/auth/logout')).status).toBe(204);
    const after = await agent.get('/api/auth/me');
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('unauthenticated');
  });

  it('answers /me without a session with 401 JSON', async () => {
    const res = await request(ctx.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.headers['content-type']).toMatch(/json/);
  });
});

describe('health and unknown routes', () => {
  it('reports the database as up', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, db: true });
  });

  it('answers an unknown API path with a JSON 404, not the web page', async () => {
    const res = await request(ctx.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('sends security headers (helmet)', async () => {
    const res = await request(ctx.app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['content-security-policy']).toBeDefined();
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});
