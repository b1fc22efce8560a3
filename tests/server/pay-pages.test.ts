// The customer's /pay pages with a malformed link or token: the same "link not recognised" page as
// an unknown one (a page, not JSON), with the pages' headers, for every route.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../helpers/test-app';

let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

const long = 'a'.repeat(65);
const routes: Array<['get' | 'post', string]> = [
  ['get', '/pay/deposit/short'],
  ['post', '/pay/deposit/short'],
  ['get', `/pay/deposit/${'b'.repeat(501)}`],
  ['get', `/pay/invoice/${long}`],
  ['post', `/pay/invoice/${long}`],
  ['get', `/pay/invoice/${long}/pdf`],
  ['get', `/pay/done/${long}`],
  ['get', `/pay/cancelled/${long}`],
  ['post', `/pay/retry/${long}`],
];

describe('/pay with a malformed link', () => {
  it.each(routes)('%s %s is the link-not-recognised page', async (method, path) => {
    const res = await request(ctx.app)[method](path);
    expect(res.status).toBe(404);
    expect(res.headers['content-type']).toMatch(/^text\/html/);
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.headers['content-security-policy']).toContain("form-action 'self'");
    expect(res.text).toContain('This payment link is not valid');
  });
});
