import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PlanRevision, Space } from '../../server/db/models';
import { backfillStoredTakeoffs } from '../../server/modules/plan-revisions/plan-takeoff';
import { manyCornersPlan, manyDownlightsPlan, tinyCentresPlan } from '../shared/helpers/big-plans';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

// Every path that stores a plan refuses an oversized one the same way: 422 naming the field,
// quickly, and nothing written. The 346-byte plan stalled the server for over 13 minutes before.
let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => ctx.close());

const cases = [
  { name: '0.4 mm joist centres over 99 m', plan: tinyCentresPlan, path: 'plan.joists.centresMm' },
  { name: '100,000 outline corners', plan: () => manyCornersPlan(100_000), path: 'plan.outline' },
  { name: '5,000 downlights', plan: () => manyDownlightsPlan(5_000), path: 'plan.exclusions' },
];

describe.each(cases)('a plan with $name', ({ plan, path }) => {
  it('is refused by PUT /api/spaces/:id/plan with a 422 naming the field, quickly, writing nothing', async () => {
    const { space } = await createJob(org);
    const agent = await loginAs(ctx.app, org.estimator);
    const started = Date.now();
    const res = await agent.put(`/api/spaces/${space.id}/plan`).send({ plan: plan(), baseRevision: 0 });
    expect(res.status).toBe(422);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(path);
    expect(Date.now() - started).toBeLessThan(5_000);
    expect(await PlanRevision.count({ where: { spaceId: space.id } })).toBe(0);
  });

  it('is refused the same way by POST /api/jobs/:id/spaces (which stored it unchecked for takeoff cost), creating no space', async () => {
    const { job } = await createJob(org);
    const agent = await loginAs(ctx.app, org.estimator);
    const res = await agent.post(`/api/jobs/${job.id}/spaces`).send({ name: 'Huge', plan: plan() });
    expect(res.status).toBe(422);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(path);
    expect(await Space.count({ where: { jobId: job.id } })).toBe(1);
  });

  it('is refused when restoring a revision that holds it (stored before the limits)', async () => {
    const { space } = await createJob(org);
    await PlanRevision.create({ organisationId: org.id, spaceId: space.id, revision: 1, plan: plan() as never, authorId: null });
    const agent = await loginAs(ctx.app, org.estimator);
    const res = await agent.post(`/api/spaces/${space.id}/revisions/1/restore`).send({ baseRevision: 1 });
    expect(res.status).toBe(422);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(path);
    expect(await PlanRevision.count({ where: { spaceId: space.id } })).toBe(1);
  });
});

it('a stored 0.4 mm plan no longer hangs the start-up takeoff backfill: refused quickly, reported, left without a takeoff', async () => {
  const { space } = await createJob(org, { stage: 'surveyed' });
  await PlanRevision.create({ organisationId: org.id, spaceId: space.id, revision: 1, plan: tinyCentresPlan() as never, authorId: null });
  const lines: string[] = [];
  const started = Date.now();
  const r = await backfillStoredTakeoffs((line) => lines.push(line));
  expect(Date.now() - started).toBeLessThan(10_000);
  expect(r.failed).toBeGreaterThanOrEqual(1);
  expect(lines.find((l) => l.includes(space.id))).toMatch(/bays/);
  expect((await PlanRevision.findOne({ where: { spaceId: space.id } }))!.takeoff).toBeNull();
});
