// Structured request logs (pino-http): one JSON line per request with its id, the user and the
// company, and nothing private (no cookie, no password, no customer's private quote token).
import { Writable } from 'node:stream';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app';
import { createLogger } from '../../server/lib/logger';
import { createOrgWithUsers, createTestContext, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;
const lines: string[] = [];
let app: ReturnType<typeof createApp>;
beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  const sink = new Writable({
    write(chunk, _enc, done) {
      lines.push(...String(chunk).split('\n').filter(Boolean));
      done();
    },
  });
  app = createApp({ ...ctx.deps, logger: createLogger({ level: 'info', destination: sink }) });
});
afterAll(async () => ctx?.close());

const entries = () => lines.map((l) => JSON.parse(l) as Record<string, unknown> & { req?: { id: string; url: string }; res?: { statusCode: number } });

describe('request logs', () => {
  it('names the request, the user and the company, echoes the request id, and logs no secrets', async () => {
    const agent = request.agent(app);
    const login = await agent.post('/api/auth/login').send({ email: org.office.email, password: org.office.password });
    expect(login.status).toBe(200);
    const me = await agent.get('/api/auth/me').set('X-Request-Id', 'probe-123');
    expect(me.status).toBe(200);
    expect(me.headers['x-request-id']).toBe('probe-123');
    await request(app).get('/api/public/quotes/some-private-token-abc');
    await expect.poll(() => entries().filter((e) => e.req).length).toBeGreaterThanOrEqual(3);
    const meLine = entries().find((e) => e.req?.id === 'probe-123')!;
    // The whole path as it arrived, not the part left after the routers it passed through.
    expect(meLine).toMatchObject({ req: { url: '/api/auth/me' }, userId: org.office.id, organisationId: org.id, res: { statusCode: 200 } });
    const all = lines.join('\n');
    expect(all).not.toContain(org.office.password);
    expect(all).not.toMatch(/connect\.sid|quiltline\.sid|cookie/i);
    expect(all).not.toContain('some-private-token-abc');
    // A request without a usable id gets a fresh one.
    const loginLine = entries().find((e) => e.req?.url === '/api/auth/login')!;
    expect(loginLine.req!.id).toMatch(/^[0-9a-f-]{36}$/);
  });
});
