import type { Response } from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobNote, JobTick } from '../../server/db/models';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { priceKeyPaths, scheduledJobWithTakeoff } from './job-sheet-fixtures';

let ctx: TestContext;
let org: TestOrg;
let other: TestOrg;
// Every response an installer received in this file; checked for price-like keys at the end.
const installerResponses: { url: string; body: unknown }[] = [];

function seen(url: string, res: Response) {
  installerResponses.push({ url, body: res.body });
  return res;
}

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  other = await createOrgWithUsers(ctx);
});
afterAll(async () => {
  await ctx?.close();
});

describe('installer access', () => {
  it('lists only the jobs assigned to the installer, and opens only those', async () => {
    const mine = await scheduledJobWithTakeoff(org);
    const colleague = await (await import('../helpers/test-app')).createUser(org.id, 'installer');
    const notMine = await scheduledJobWithTakeoff(org, { installerId: colleague.id });
    const unassigned = await createJob(org, { stage: 'accepted' });
    const foreign = await scheduledJobWithTakeoff(other);
    const agent = await loginAs(ctx.app, org.installer);

    const list = seen('/api/my-jobs', await agent.get('/api/my-jobs'));
    expect(list.status).toBe(200);
    const ids = list.body.jobs.map((j: { id: string }) => j.id);
    expect(ids).toContain(mine.job.id);
    expect(ids).not.toContain(notMine.job.id);
    expect(ids).not.toContain(unassigned.job.id);
    expect(ids).not.toContain(foreign.job.id);

    for (const id of [notMine.job.id, unassigned.job.id, foreign.job.id]) {
      expect((await agent.get(`/api/jobs/${id}`)).status).toBe(404);
      expect((await agent.get(`/api/jobs/${id}/job-sheet`)).status).toBe(404);
    }
  });

  it('gives the installer the job sheet on its own endpoint: plan, numbered strips, cut list, van load, checks', async () => {
    const { job, space, takeoff } = await scheduledJobWithTakeoff(org);
    const agent = await loginAs(ctx.app, org.installer);
    // GET /api/jobs/:id has one shape for every role: the job, and no sheet riding along.
    const plain = seen(`/api/jobs/${job.id}`, await agent.get(`/api/jobs/${job.id}`));
    expect(plain.status).toBe(200);
    expect(Object.keys(plain.body)).toEqual(['job']);
    expect(Object.keys(plain.body.job).sort()).toEqual(Object.keys((await (await loginAs(ctx.app, org.office)).get(`/api/jobs/${job.id}`)).body.job).sort());
    const res = seen(`/api/jobs/${job.id}/job-sheet`, await agent.get(`/api/jobs/${job.id}/job-sheet`));
    expect(res.status).toBe(200);
    const sheet = res.body.sheet;
    expect(sheet.job.accessNotes).toBe('Key with neighbour at no. 10');
    const s = sheet.spaces.find((x: { id: string }) => x.id === space.id);
    expect(s.problem).toBeNull();
    expect(s.plan.outline).toHaveLength(4);
    expect(s.layers.map((l: { key: string }) => l.key)).toEqual(takeoff.layers.map((l) => (l.role === 'base' ? 'base' : `cross${l.roleIndex + 1}`)));
    const stripCount = takeoff.layers.reduce((n, l) => n + l.strips.length, 0);
    expect(s.layers.reduce((n: number, l: { strips: unknown[] }) => n + l.strips.length, 0)).toBe(stripCount);
    // Every piece of every strip appears once in the cut list.
    const pieces = takeoff.layers.reduce((n, l) => n + l.strips.reduce((m, st) => m + st.pieces.length, 0), 0);
    const cuts = s.rolls.flatMap((r: { lanes: { cuts: unknown[] }[] }) => r.lanes.flatMap((l) => l.cuts));
    expect(cuts).toHaveLength(pieces);
    // The van load counts the packed rolls per product (no prices).
    const packed = takeoff.layers.reduce((n, l) => n + l.rollsByPacking, 0);
    expect(sheet.vanLoad.rolls.reduce((n: number, r: { count: number }) => n + r.count, 0)).toBe(packed);
    expect(sheet.vanLoad.extras.find((x: { label: string }) => /downlight/i.test(x.label)).quantity).toBe(5);
    expect(s.checks.map((c: { code: string }) => c.code)).toEqual(
      expect.arrayContaining(['tank.no-insulation-beneath', 'downlight.covers', 'eaves.ventilation-gap']),
    );
    expect(sheet.cautions.join(' ')).toMatch(/local building regulations/i);
    // The takeoff itself carries prices; the sheet built from it must not.
    expect(priceKeyPaths(takeoff).length).toBeGreaterThan(0);
    expect(priceKeyPaths(res.body)).toEqual([]);
  });
});

describe('ticks and notes', () => {
  it('records a check tick once per idempotency key, with who and when', async () => {
    const { job, space } = await scheduledJobWithTakeoff(org);
    const agent = await loginAs(ctx.app, org.installer);
    const body = { kind: 'check', spaceId: space.id, ref: 'downlight.covers', done: true };
    const first = seen('ticks', await agent.post(`/api/jobs/${job.id}/ticks`).set('Idempotency-Key', 'tick-key-0001').send(body));
    const again = seen('ticks', await agent.post(`/api/jobs/${job.id}/ticks`).set('Idempotency-Key', 'tick-key-0001').send(body));
    expect(first.status).toBe(200);
    expect(again.status).toBe(200);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(again.body).toEqual(first.body);
    expect(first.body.tick.by.name).toBe(org.installer.name);
    expect(await JobTick.count({ where: { jobId: job.id } })).toBe(1);

    // Unticking is a new request with a new key; the one row changes.
    const off = await agent
      .post(`/api/jobs/${job.id}/ticks`)
      .set('Idempotency-Key', 'tick-key-0002')
      .send({ ...body, done: false });
    expect(off.body.tick.done).toBe(false);
    expect(await JobTick.count({ where: { jobId: job.id } })).toBe(1);

    // A key reused on another endpoint is refused rather than answered with the wrong body.
    const reused = await agent.post(`/api/jobs/${job.id}/notes`).set('Idempotency-Key', 'tick-key-0001').send({ text: 'x' });
    expect(reused.status).toBe(409);
    expect(reused.body.error.code).toBe('idempotency_key_reused');
  });

  it('ticks strips as cut (per piece) and laid (per strip), and shows them in the sheet', async () => {
    const { job, space } = await scheduledJobWithTakeoff(org);
    const agent = await loginAs(ctx.app, org.installer);
    const sheet = (await agent.get(`/api/jobs/${job.id}/job-sheet`)).body.sheet;
    const cut = sheet.spaces[0].rolls[0].lanes[0].cuts[0];
    expect((await agent.post(`/api/jobs/${job.id}/ticks`).send({ kind: 'strip-cut', spaceId: space.id, ref: cut.id, done: true })).status).toBe(200);
    expect((await agent.post(`/api/jobs/${job.id}/ticks`).send({ kind: 'strip-laid', spaceId: space.id, ref: cut.stripId, done: true })).status).toBe(200);
    const after = seen('job-sheet', await agent.get(`/api/jobs/${job.id}/job-sheet`)).body.sheet;
    expect(after.ticks.map((t: { kind: string; ref: string; done: boolean }) => `${t.kind} ${t.ref} ${t.done}`).sort()).toEqual([
      `strip-cut ${cut.id} true`,
      `strip-laid ${cut.stripId} true`,
    ]);
  });

  it('refuses a tick for a space of another job, a reason on a strip, and an estimator', async () => {
    const { job } = await scheduledJobWithTakeoff(org);
    const elsewhere = await scheduledJobWithTakeoff(org);
    const agent = await loginAs(ctx.app, org.installer);
    const wrongSpace = await agent.post(`/api/jobs/${job.id}/ticks`).send({ kind: 'check', spaceId: elsewhere.space.id, ref: 'ppe.dust', done: true });
    expect(wrongSpace.status).toBe(422);
    expect(wrongSpace.body.error.details[0].path).toBe('spaceId');
    const estimator = await loginAs(ctx.app, org.estimator);
    expect((await estimator.post(`/api/jobs/${job.id}/ticks`).send({ kind: 'check', spaceId: elsewhere.space.id, ref: 'ppe.dust', done: true })).status).toBe(
      403,
    );
    const bad = await agent.post(`/api/jobs/${job.id}/ticks`).send({ kind: 'sideways', spaceId: elsewhere.space.id, ref: 'x', done: true });
    expect(bad.status).toBe(422);
  });

  it('adds a note once however often the same request is repeated', async () => {
    const { job } = await scheduledJobWithTakeoff(org);
    const agent = await loginAs(ctx.app, org.installer);
    for (let i = 0; i < 3; i++) {
      const res = seen('notes', await agent.post(`/api/jobs/${job.id}/notes`).set('Idempotency-Key', 'note-key-0001').send({ text: 'Hatch frame is loose' }));
      expect(res.status).toBe(201);
    }
    expect(await JobNote.count({ where: { jobId: job.id } })).toBe(1);
    expect((await agent.post(`/api/jobs/${job.id}/notes`).send({ text: '   ' })).status).toBe(422);
  });
});

describe('what an installer receives', () => {
  it('carries no price, cost, margin or total key in any response of this file', async () => {
    const agent = await loginAs(ctx.app, org.installer);
    const { job } = await scheduledJobWithTakeoff(org);
    for (const url of ['/api/auth/me', '/api/my-jobs', '/api/jobs', `/api/jobs/${job.id}`, `/api/jobs/${job.id}/job-sheet`]) {
      const res = await agent.get(url);
      expect(res.status, url).toBe(200);
      installerResponses.push({ url, body: res.body });
    }
    expect(installerResponses.length).toBeGreaterThan(10);
    for (const r of installerResponses) expect(priceKeyPaths(r.body), r.url).toEqual([]);
  });
});
