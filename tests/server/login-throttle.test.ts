// Sign-in limits per account and per address with a short back-off (a fixed 15-minute window
// locked the right password out for everyone behind one address after 20 wrong ones).
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BackoffThrottle, loginThrottles } from '../../server/modules/auth/login-throttle';
import { createOrgWithUsers, createTestContext, type TestContext, type TestOrg } from '../helpers/test-app';

describe('the back-off (pure, with a clock of its own)', () => {
  it('lets the free failures through, then waits 1 s, 2 s, 4 s … up to the cap, forgets after 15 min, and a success clears it', () => {
    let t = 0;
    const th = new BackoffThrottle({ freeFailures: 3, baseDelayMs: 1000, maxDelayMs: 30_000, forgetAfterMs: 15 * 60_000 }, () => t);
    for (let i = 0; i < 2; i++) th.recordFailure('a');
    expect(th.waitMs('a')).toBe(0);
    th.recordFailure('a'); // third: the back-off starts
    expect(th.waitMs('a')).toBe(1000);
    th.recordFailure('a');
    expect(th.waitMs('a')).toBe(2000);
    t += 2000;
    expect(th.waitMs('a')).toBe(0);
    for (let i = 0; i < 20; i++) th.recordFailure('a');
    expect(th.waitMs('a')).toBe(30_000); // capped
    expect(th.waitMs('b')).toBe(0); // keys are independent
    t += 15 * 60_000 + 1;
    expect(th.waitMs('a')).toBe(0);
    th.recordFailure('a');
    expect(th.waitMs('a')).toBe(0); // forgotten: counting starts again
    th.clear('a');
    expect(th.waitMs('a')).toBe(0);
  });

  it('gives an address five times the room of an account', () => {
    const { account, address } = loginThrottles(20, () => 0);
    for (let i = 0; i < 20; i++) {
      account.recordFailure('x@example.com');
      address.recordFailure('203.0.113.7');
    }
    expect(account.waitMs('x@example.com')).toBeGreaterThan(0);
    expect(account.waitMs('x@example.com')).toBeLessThanOrEqual(30_000);
    expect(address.waitMs('203.0.113.7')).toBe(0);
  });
});

let ctx: TestContext;
let org: TestOrg;
beforeAll(async () => {
  // The production default of LOGIN_RATE_LIMIT (20), and client addresses from X-Forwarded-For.
  ctx = await createTestContext({ LOGIN_RATE_LIMIT: '20', TRUST_PROXY: '1' });
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => ctx?.close());

const login = (email: string, password: string, from: string) =>
  request(ctx.app).post('/api/auth/login').set('X-Forwarded-For', from).send({ email, password });

describe('sign-in limits through the API', () => {
  it('after 20 wrong passwords the owner waits seconds, not 15 minutes, and a colleague behind the same address signs in at once', async () => {
    const office = '198.51.100.20';
    for (let i = 0; i < 20; i++) expect([401, 429]).toContain((await login(org.estimator.email, `wrong-${i}`, office)).status);
    const blocked = await login(org.estimator.email, org.estimator.password, office);
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(0);
    expect(Number(blocked.headers['retry-after'])).toBeLessThanOrEqual(30);
    expect((await login(org.installer.email, org.installer.password, office)).status).toBe(200);
  });

  it('lets the right password in by itself once the short back-off has passed', async () => {
    const from = '198.51.100.21';
    for (let i = 0; i < 6; i++) await login(org.office.email, `wrong-${i}`, from);
    expect((await login(org.office.email, org.office.password, from)).status).toBe(429);
    await expect.poll(async () => (await login(org.office.email, org.office.password, from)).status, { timeout: 15_000, interval: 500 }).toBe(200);
  });

  it('slows one address guessing across many accounts, and only that address', async () => {
    // LOGIN_RATE_LIMIT 4: 4 failures per account, 20 per address (each a bcrypt compare; kept small).
    const small = await createTestContext({ LOGIN_RATE_LIMIT: '4', TRUST_PROXY: '1' });
    try {
      const attempt = (email: string, from: string) =>
        request(small.app).post('/api/auth/login').set('X-Forwarded-For', from).send({ email, password: 'guess' });
      const guesser = '198.51.100.66';
      for (let i = 0; i < 20; i++) expect((await attempt(`nobody-${i}@example.com`, guesser)).status).toBe(401);
      const res = await attempt('nobody-next@example.com', guesser);
      expect(res.status).toBe(429);
      expect(Number(res.headers['retry-after'])).toBeLessThanOrEqual(60);
      expect((await attempt('nobody-next@example.com', '198.51.100.67')).status).toBe(401);
    } finally {
      await small.close();
    }
  }, 60_000);
});
