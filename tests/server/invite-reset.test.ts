// Invite and password-reset e-mails, read back from the fake SMTP server; each link works once.
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { AuthToken } from '../../server/db/models';
import { hashToken } from '../../server/modules/auth/auth.service';
import { createOrgWithUsers, createTestContext, loginAs, tokenFromLink, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
beforeEach(() => ctx.outbox.clear());
afterAll(async () => ctx?.close());

describe('inviting a user', () => {
  it('e-mails a set-password link that works exactly once, then the user can sign in', async () => {
    const office = await loginAs(ctx.app, org.office);
    const email = `new-estimator-${Date.now()}@test.example.com`;
    const invited = await office.post('/api/users').send({ email, name: 'Nell Estimator', role: 'estimator' });
    expect(invited.status).toBe(201);
    expect(invited.body.user).toMatchObject({ email, role: 'estimator', active: true, hasPassword: false });

    const mail = await ctx.outbox.waitFor((m) => m.envelopeTo.includes(email));
    expect(mail.subject).toContain(org.name);
    const token = tokenFromLink(mail.links, '/set-password');
    expect(new URL(mail.links[0]).origin).toBe(ctx.config.appUrl);

    // Only the hash is stored.
    expect(await AuthToken.count({ where: { tokenHash: token } })).toBe(0);
    expect(await AuthToken.count({ where: { tokenHash: hashToken(token) } })).toBe(1);

    const first = await request(ctx.app).post('/api/auth/set-password').send({ token, password: 'a-good-long-password' });
    expect(first.status).toBe(200);
    const again = await request(ctx.app).post('/api/auth/set-password').send({ token, password: 'another-long-password' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');

    const login = await request(ctx.app).post('/api/auth/login').send({ email, password: 'a-good-long-password' });
    expect(login.status).toBe(200);
    expect(login.body.user.organisation.id).toBe(org.id);
    const stale = await request(ctx.app).post('/api/auth/login').send({ email, password: 'another-long-password' });
    expect(stale.status).toBe(401);
  });

  it('refuses an e-mail that is already in use, naming the field', async () => {
    const office = await loginAs(ctx.app, org.office);
    const res = await office.post('/api/users').send({ email: org.estimator.email, name: 'Dup', role: 'estimator' });
    expect(res.status).toBe(409);
    expect(res.body.error.details[0].path).toBe('email');
    expect(ctx.outbox.messages()).toHaveLength(0);
  });

  it('refuses a short password with 422 naming the field, and the link still works afterwards', async () => {
    const office = await loginAs(ctx.app, org.office);
    const email = `short-${Date.now()}@test.example.com`;
    await office.post('/api/users').send({ email, name: 'Short Pw', role: 'installer' });
    const token = tokenFromLink((await ctx.outbox.waitFor((m) => m.envelopeTo.includes(email))).links, '/set-password');
    const short = await request(ctx.app).post('/api/auth/set-password').send({ token, password: 'short' });
    expect(short.status).toBe(422);
    expect(short.body.error.details[0].path).toBe('password');
    const ok = await request(ctx.app).post('/api/auth/set-password').send({ token, password: 'long-enough-now' });
    expect(ok.status).toBe(200);
  });

  it('shows invitations in the office outbox, and only the company’s own', async () => {
    const office = await loginAs(ctx.app, org.office);
    const email = `outbox-${Date.now()}@test.example.com`;
    await office.post('/api/users').send({ email, name: 'Outbox Person', role: 'estimator' });
    await ctx.outbox.waitFor((m) => m.envelopeTo.includes(email));
    const res = await office.get('/api/dev/outbox');
    expect(res.status).toBe(200);
    expect(res.body.enabled).toBe(true);
    expect(res.body.messages.map((m: { to: string }) => m.to)).toContain(email);

    const other = await createOrgWithUsers(ctx);
    const otherOffice = await loginAs(ctx.app, other.office);
    const theirs = await otherOffice.get('/api/dev/outbox');
    expect(theirs.body.messages.map((m: { to: string }) => m.to)).not.toContain(email);
  });
});

describe('password reset', () => {
  it('answers 200 whether or not the e-mail is known, and mails only known users', async () => {
    const unknown = await request(ctx.app).post('/api/auth/request-reset').send({ email: 'nobody-at-all@test.example.com' });
    const known = await request(ctx.app).post('/api/auth/request-reset').send({ email: org.installer.email });
    expect(unknown.status).toBe(200);
    expect(known.status).toBe(200);
    expect(unknown.body).toEqual(known.body);
    await ctx.outbox.waitFor((m) => m.envelopeTo.includes(org.installer.email));
    expect(ctx.outbox.messages().filter((m) => m.envelopeTo.includes('nobody-at-all@test.example.com'))).toHaveLength(0);
  });

  it('the reset link changes the password once, and ends existing sessions', async () => {
    const { estimator } = await createOrgWithUsers(ctx);
    const oldSession = await loginAs(ctx.app, estimator);
    await request(ctx.app).post('/api/auth/request-reset').send({ email: estimator.email });
    const mail = await ctx.outbox.waitFor((m) => m.envelopeTo.includes(estimator.email));
    expect(mail.subject).toMatch(/reset/i);
    const token = tokenFromLink(mail.links, '/reset-password');

    expect((await request(ctx.app).post('/api/auth/set-password').send({ token, password: 'brand-new-password' })).status).toBe(200);
    expect((await request(ctx.app).post('/api/auth/set-password').send({ token, password: 'second-new-password' })).status).toBe(400);
    expect((await oldSession.get('/api/auth/me')).status).toBe(401);
    expect((await request(ctx.app).post('/api/auth/login').send({ email: estimator.email, password: estimator.password })).status).toBe(401);
    expect((await request(ctx.app).post('/api/auth/login').send({ email: estimator.email, password: 'brand-new-password' })).status).toBe(200);
  });

  it('refuses an expired link', async () => {
    const { installer } = await createOrgWithUsers(ctx);
    await request(ctx.app).post('/api/auth/request-reset').send({ email: installer.email });
    const token = tokenFromLink((await ctx.outbox.waitFor((m) => m.envelopeTo.includes(installer.email))).links, '/reset-password');
    await AuthToken.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { tokenHash: hashToken(token) } });
    const res = await request(ctx.app).post('/api/auth/set-password').send({ token, password: 'too-late-password' });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_token');
  });

  it('refuses a made-up token', async () => {
    const res = await request(ctx.app).post('/api/auth/set-password').send({ token: 'made-up-token-value-123', password: 'whatever-password' });
    expect(res.status).toBe(400);
  });
});

describe('deactivating a user', () => {
  it('refuses their sign-in and ends their open sessions at once', async () => {
    const { office, installer } = await createOrgWithUsers(ctx);
    const officeAgent = await loginAs(ctx.app, office);
    const installerAgent = await loginAs(ctx.app, installer);
    expect((await installerAgent.get('/api/jobs')).status).toBe(200);

    const res = await officeAgent.patch(`/api/users/${installer.id}`).send({ active: false });
    expect(res.status).toBe(200);
    expect(res.body.user.active).toBe(false);

    expect((await installerAgent.get('/api/jobs')).status).toBe(401);
    const login = await request(ctx.app).post('/api/auth/login').send({ email: installer.email, password: installer.password });
    expect(login.status).toBe(401);
    // and no reset mail for an inactive account
    await request(ctx.app).post('/api/auth/request-reset').send({ email: installer.email });
    // A reset asked for an active account afterwards goes the same way: once its mail is in, one
    // for the inactive account would be too.
    await request(ctx.app).post('/api/auth/request-reset').send({ email: office.email });
    await ctx.outbox.waitFor((m) => m.envelopeTo.includes(office.email) && /Reset your Quiltline password/.test(m.subject));
    expect(ctx.outbox.messages().filter((m) => m.envelopeTo.includes(installer.email))).toHaveLength(0);

    expect((await officeAgent.patch(`/api/users/${installer.id}`).send({ active: true })).status).toBe(200);
    expect((await request(ctx.app).post('/api/auth/login').send({ email: installer.email, password: installer.password })).status).toBe(200);
  });

  it('does not let office users deactivate themselves or change their own role', async () => {
    const { office } = await createOrgWithUsers(ctx);
    const agent = await loginAs(ctx.app, office);
    expect((await agent.patch(`/api/users/${office.id}`).send({ active: false })).status).toBe(409);
    expect((await agent.patch(`/api/users/${office.id}`).send({ role: 'installer' })).status).toBe(409);
    expect((await agent.patch(`/api/users/${office.id}`).send({ name: 'Renamed Office' })).status).toBe(200);
  });

  it('takes effect when the role changes: an estimator made installer loses customer access', async () => {
    const { office, estimator } = await createOrgWithUsers(ctx);
    const officeAgent = await loginAs(ctx.app, office);
    const estAgent = await loginAs(ctx.app, estimator);
    expect((await estAgent.get('/api/customers')).status).toBe(200);
    await officeAgent.patch(`/api/users/${estimator.id}`).send({ role: 'installer' });
    expect((await estAgent.get('/api/customers')).status).toBe(403);
  });
});

describe('in production', () => {
  it('does not mount the dev outbox', async () => {
    const prod = await createTestContext({
      NODE_ENV: 'production',
      SESSION_SECRET: 'a-production-secret-for-this-test',
      // a relay that is never contacted in this test: production refuses to start without one
      SMTP_URL: 'smtp://127.0.0.1:2',
    });
    try {
      expect(prod.deps.outbox).toBeNull();
      const office = await loginAs(prod.app, org.office);
      const res = await office.get('/api/dev/outbox');
      expect(res.status).toBe(404);
      expect((await office.get('/api/auth/me')).status).toBe(200);
    } finally {
      await prod.close();
    }
  });
});

describe('reset requests reveal nothing by time or body', () => {
  it('answers a known address before any mail work is done, and the same even when the mail server fails', async () => {
    const { estimator } = await createOrgWithUsers(ctx);
    const mailer = ctx.deps.mailer;
    const realSend = mailer.send;
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    // A mail server that does not answer until the test lets it: the reply must not wait for it.
    mailer.send = async (m) => {
      await gate;
      return realSend.call(mailer, m);
    };
    try {
      const unknown = await request(ctx.app).post('/api/auth/request-reset').send({ email: 'no-such-account@test.example.com' });
      const known = await request(ctx.app).post('/api/auth/request-reset').timeout(10_000).send({ email: estimator.email });
      expect(known.status).toBe(200);
      expect(known.body).toEqual(unknown.body);
      release();
      await ctx.outbox.waitFor((m) => m.envelopeTo.includes(estimator.email));

      mailer.send = async () => {
        throw new Error('connect ECONNREFUSED 127.0.0.1:25');
      };
      const failing = await request(ctx.app).post('/api/auth/request-reset').send({ email: estimator.email });
      expect(failing.status).toBe(200);
      expect(failing.body).toEqual(unknown.body);
    } finally {
      release();
      mailer.send = realSend;
    }
  });
});
