// Sign-in limits are counted in PostgreSQL: failures spread over two app instances on one database
// are limited as one (in memory each instance would have seen only half of them).
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createOrgWithUsers, createTestContext, type TestContext, type TestOrg } from '../helpers/test-app';

let a: TestContext;
let b: TestContext;
let org: TestOrg;
beforeAll(async () => {
  // LOGIN_RATE_LIMIT 4: four free failures per account, twenty per address.
  a = await createTestContext({ LOGIN_RATE_LIMIT: '4', TRUST_PROXY: '1' });
  b = await createTestContext({ LOGIN_RATE_LIMIT: '4', TRUST_PROXY: '1' });
  org = await createOrgWithUsers(a);
});
afterAll(async () => {
  await a?.close();
  await b?.close();
});

const login = (ctx: TestContext, email: string, password: string, from: string) =>
  request(ctx.app).post('/api/auth/login').set('X-Forwarded-For', from).send({ email, password });

describe('sign-in limits across instances', () => {
  it('counts an account’s failures on both instances together', async () => {
    const from = '203.0.113.40';
    for (let i = 0; i < 4; i++) expect((await login(i % 2 ? b : a, org.estimator.email, `wrong-${i}`, from)).status).toBe(401);
    const onA = await login(a, org.estimator.email, org.estimator.password, from);
    const onB = await login(b, org.estimator.email, org.estimator.password, from);
    expect(onA.status).toBe(429);
    expect(onB.status).toBe(429);
    expect(Number(onB.headers['retry-after'])).toBeGreaterThan(0);
    // Another account behind the same address is not held back.
    expect((await login(b, org.installer.email, org.installer.password, from)).status).toBe(200);
  });

  it('counts one address guessing across accounts on both instances together', async () => {
    const guesser = '203.0.113.66';
    // 20 free failures per address, spread over 10 accounts (2 each, under the account limit) and both instances.
    for (let i = 0; i < 20; i++) {
      expect((await login(i % 2 ? b : a, `nobody-${i % 10}-${Date.now()}@example.com`, 'guess', guesser)).status).toBe(401);
    }
    expect((await login(a, org.office.email, org.office.password, guesser)).status).toBe(429);
    expect((await login(b, org.office.email, org.office.password, '203.0.113.67')).status).toBe(200);
  });
});
