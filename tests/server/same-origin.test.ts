// Cross-site request forgery: a page on another port of the same host (the same *site*, so the
// SameSite=Lax cookie goes along) posting to the API with the office's session cookie is refused
// with 403 and changes nothing; the app's own pages (same origin) and non-browser clients work; the
// signed payments webhook is not subject to the check.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Customer } from '../../server/db/models';
import { createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;
const APP = 'http://127.0.0.1:3000'; // the context's APP_URL
const EVIL = 'http://127.0.0.1:4000'; // another port on the same host

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => ctx?.close());

const customer = (name: string) => ({ name, address: { line1: '4 Forge Lane', town: 'Testbury', postcode: 'TE4 4FL' } });

describe('same-origin check on state-changing requests', () => {
  it('refuses a cross-origin POST carrying the session cookie, whichever header gives it away, and changes nothing', async () => {
    const office = await loginAs(ctx.app, org.office);
    const attempts = [
      { 'Sec-Fetch-Site': 'same-site', Origin: EVIL },
      { 'Sec-Fetch-Site': 'cross-site' },
      { Origin: EVIL },
      { Origin: 'null' },
      { Referer: `${EVIL}/attack.html` },
    ];
    for (const [i, headers] of attempts.entries()) {
      const res = await office
        .post('/api/customers')
        .set(headers)
        .send(customer(`Forged ${i}`));
      expect(res.status, JSON.stringify(headers)).toBe(403);
      expect(res.body.error.code).toBe('cross_origin');
      expect(await Customer.count({ where: { organisationId: org.id, name: `Forged ${i}` } })).toBe(0);
    }
    // A body-less POST (the exposed kind): logging out from another site is refused too.
    expect((await office.post('/api/auth/logout').set('Origin', EVIL)).status).toBe(403);
    expect((await office.get('/api/auth/me')).status).toBe(200);
    // Reading is not a state change.
    expect((await office.get('/api/customers').set('Origin', EVIL)).status).toBe(200);
  });

  it('lets the app itself and non-browser clients through', async () => {
    const office = await loginAs(ctx.app, org.office);
    expect((await office.post('/api/customers').set({ 'Sec-Fetch-Site': 'same-origin', Origin: APP }).send(customer('Own page 1'))).status).toBe(201);
    expect((await office.post('/api/customers').set('Origin', APP).send(customer('Own page 2'))).status).toBe(201);
    expect((await office.post('/api/customers').set('Referer', `${APP}/customers`).send(customer('Own page 3'))).status).toBe(201);
    expect((await office.post('/api/customers').send(customer('Script'))).status).toBe(201);
    expect((await office.post('/api/auth/logout').set('Sec-Fetch-Site', 'same-origin')).status).toBe(204);
  });

  it('leaves the payments webhook to its signature check', async () => {
    const res = await request(ctx.app)
      .post('/api/payments/webhook')
      .set({ Origin: EVIL, 'Sec-Fetch-Site': 'cross-site', 'content-type': 'application/json' })
      .send('{}');
    expect(res.status).not.toBe(403);
  });
});
