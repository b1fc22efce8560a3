// Removing a space keeps it and its revisions; Undo brings it back whole. Removed spaces leave the
// job, its plan read, its quote and its job sheet; only roles that may edit plans remove or restore.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PlanRevision, Space } from '../../server/db/models';
import { planSchema } from '../../shared/plan/plan-schema';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => {
  await ctx?.close();
});

const plan = planSchema.parse({
  format: 'quiltline-plan/1',
  name: 'Garage loft',
  outline: [
    [0, 0],
    [4000, 0],
    [4000, 3000],
    [0, 3000],
  ],
  joists: { angleDeg: 90, centresMm: 400, widthMm: 47, depthMm: 100 },
});

describe('removing a space, and undo', () => {
  it('keeps the space and its revisions, hides it everywhere, and restores it with its plan', async () => {
    const { job, space } = await createJob(org, { plan });
    const estimator = await loginAs(ctx.app, org.estimator);
    const revisionsBefore = await PlanRevision.count({ where: { spaceId: space.id } });
    expect(revisionsBefore).toBeGreaterThan(0);

    expect((await estimator.delete(`/api/spaces/${space.id}`)).status).toBe(204);
    // Kept: the row (marked) and every revision.
    const kept = await Space.findByPk(space.id, { paranoid: false });
    expect(kept?.deletedAt).toBeInstanceOf(Date);
    expect(await PlanRevision.count({ where: { spaceId: space.id } })).toBe(revisionsBefore);
    // Hidden: the job's list, the space, its plan read.
    expect((await estimator.get(`/api/jobs/${job.id}`)).body.job.spaces.map((s: { id: string }) => s.id)).not.toContain(space.id);
    expect((await estimator.get(`/api/spaces/${space.id}`)).status).toBe(404);
    expect((await estimator.get(`/api/spaces/${space.id}/plan`)).status).toBe(404);

    const back = await estimator.post(`/api/spaces/${space.id}/restore`).send();
    expect(back.status).toBe(200);
    expect(back.body.space.id).toBe(space.id);
    expect((await estimator.get(`/api/jobs/${job.id}`)).body.job.spaces.map((s: { id: string }) => s.id)).toContain(space.id);
    const read = await estimator.get(`/api/spaces/${space.id}/plan`);
    expect(read.status).toBe(200);
    expect(read.body.plan.outline).toEqual(plan.outline);
    const kinds = (await estimator.get(`/api/jobs/${job.id}/events`)).body.events.map((e: { kind: string }) => e.kind);
    expect(kinds).toEqual(expect.arrayContaining(['space_removed', 'space_restored']));
  });

  it('restores once when two undos race, and answers a space that was never removed as it is', async () => {
    const { job, space } = await createJob(org, { plan });
    const estimator = await loginAs(ctx.app, org.estimator);
    await estimator.delete(`/api/spaces/${space.id}`);
    const [a, b] = await Promise.all([estimator.post(`/api/spaces/${space.id}/restore`).send(), estimator.post(`/api/spaces/${space.id}/restore`).send()]);
    expect([a.status, b.status]).toEqual([200, 200]);
    const events = (await estimator.get(`/api/jobs/${job.id}/events`)).body.events.filter((e: { kind: string }) => e.kind === 'space_restored');
    expect(events).toHaveLength(1);
    expect((await estimator.post(`/api/spaces/${space.id}/restore`).send()).status).toBe(200);
  });

  it('lets only roles that edit plans remove or restore, and keeps other companies out', async () => {
    const { space } = await createJob(org, { plan, assignedInstallerId: org.installer.id });
    const installer = await loginAs(ctx.app, org.installer);
    expect((await installer.delete(`/api/spaces/${space.id}`)).status).toBe(403);
    const estimator = await loginAs(ctx.app, org.estimator);
    await estimator.delete(`/api/spaces/${space.id}`);
    expect((await installer.post(`/api/spaces/${space.id}/restore`).send()).status).toBe(403);
    const other = await createOrgWithUsers(ctx, `Other Lofts ${Date.now()}`);
    const outsider = await loginAs(ctx.app, other.estimator);
    expect((await outsider.post(`/api/spaces/${space.id}/restore`).send()).status).toBe(404);
    expect((await Space.findByPk(space.id, { paranoid: false }))?.deletedAt).toBeInstanceOf(Date);
  });
});
