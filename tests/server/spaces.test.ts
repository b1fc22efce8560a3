// Spaces of a job and their first plan revision; plan revisions are appended, never overwritten.
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PlanRevision } from '../../server/db/models';
import { storePlanRevision } from '../../server/modules/plan-revisions/plan-takeoff';
import { latestRevision, latestRevisions } from '../../server/modules/plan-revisions/revisions.repository';
import { parsePlanOr422 } from '../../server/modules/spaces/spaces.service';
import type { Plan } from '../../shared/plan/plan-schema';
import { readStoredTakeoff } from '../../shared/takeoff/takeoff-schema';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;
let estimator: Awaited<ReturnType<typeof loginAs>>;

const plan = {
  format: 'quiltline-plan/1',
  name: 'Garage loft',
  outline: [
    [0, 0],
    [4000, 0],
    [4000, 3000],
    [0, 3000],
  ],
  joists: { angleDeg: 90, centresMm: 400, widthMm: 47, depthMm: 100 },
};

/** Stores a revision the way every writer does (with its takeoff). */
function addPlanRevision(
  seq: NonNullable<typeof PlanRevision.sequelize>,
  actor: { id: string; organisationId: string },
  spaceId: string,
  p: Plan,
  opts: { baseRevision?: number } = {},
) {
  return storePlanRevision(seq, { organisationId: actor.organisationId, spaceId, authorId: actor.id, plan: p, ...opts });
}

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  estimator = await loginAs(ctx.app, org.estimator);
});
afterAll(async () => ctx?.close());

describe('spaces', () => {
  it('adds a space with a first plan as revision 1 by its author, and shows it on the job', async () => {
    const { job } = await createJob(org);
    const res = await estimator.post(`/api/jobs/${job.id}/spaces`).send({ name: 'Garage loft', plan });
    expect(res.status).toBe(201);
    expect(res.body.space).toMatchObject({ name: 'Garage loft', jobId: job.id, latestRevision: 1, position: 1 });
    const rev = await PlanRevision.findOne({ where: { spaceId: res.body.space.id } });
    expect(rev?.authorId).toBe(org.estimator.id);
    expect((rev?.plan as { eavesGapMm: number }).eavesGapMm).toBe(50); // schema default filled in
    // Stored with its takeoff like every revision: 4 × 3 m, no exclusions.
    const takeoff = readStoredTakeoff(rev?.takeoff);
    expect(takeoff?.format).toBe('quiltline-takeoff/4');
    expect(takeoff?.grossAreaM2).toBe(12);
    const jobRes = await estimator.get(`/api/jobs/${job.id}`);
    expect(jobRes.body.job.spaces.map((s: { name: string; latestRevision: number | null }) => [s.name, s.latestRevision])).toEqual([
      ['Main loft', null],
      ['Garage loft', 1],
    ]);
  });

  it('refuses an invalid plan, naming the field inside the plan', async () => {
    const { job } = await createJob(org);
    const res = await estimator.post(`/api/jobs/${job.id}/spaces`).send({ name: 'Bad', plan: { ...plan, format: 'someone-else/2' } });
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].path).toBe('plan.format');
    expect(res.body.error.message).toMatch(/unknown plan format/);
  });

  it('refuses a plan whose outline crosses itself (geometry check), naming the plan', async () => {
    const { job } = await createJob(org);
    const crossed = {
      ...plan,
      outline: [
        [0, 0],
        [4000, 3000],
        [4000, 0],
        [0, 3000],
      ],
    };
    const res = await estimator.post(`/api/jobs/${job.id}/spaces`).send({ name: 'Crossed', plan: crossed });
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].path).toMatch(/^plan/);
  });

  it('renames and deletes a space', async () => {
    const { job, space } = await createJob(org);
    const renamed = await estimator.patch(`/api/spaces/${space.id}`).send({ name: 'Extension loft' });
    expect(renamed.body.space.name).toBe('Extension loft');
    expect((await estimator.delete(`/api/spaces/${space.id}`)).status).toBe(204);
    expect((await estimator.get(`/api/spaces/${space.id}`)).status).toBe(404);
    const events = await estimator.get(`/api/jobs/${job.id}/events`);
    expect(events.body.events.map((e: { kind: string }) => e.kind)).toContain('space_removed');
  });

  it('lets an installer read a space of an assigned job only', async () => {
    const mine = await createJob(org, { assignedInstallerId: org.installer.id });
    const notMine = await createJob(org);
    const installer = await loginAs(ctx.app, org.installer);
    expect((await installer.get(`/api/spaces/${mine.space.id}`)).status).toBe(200);
    expect((await installer.get(`/api/spaces/${notMine.space.id}`)).status).toBe(404);
  });
});

describe('plan revisions (service used by the plans module)', () => {
  it('appends revisions 1, 2, 3 and keeps every earlier one unchanged', async () => {
    const { space } = await createJob(org);
    const actor = {
      id: org.estimator.id,
      email: org.estimator.email,
      name: org.estimator.name,
      role: 'estimator' as const,
      organisationId: org.id,
      organisationName: org.name,
    };
    const seq = PlanRevision.sequelize!;
    const p1 = parsePlanOr422(plan);
    await addPlanRevision(seq, actor, space.id, p1, { baseRevision: 0 });
    await addPlanRevision(seq, actor, space.id, { ...p1, name: 'second' }, { baseRevision: 1 });
    await addPlanRevision(seq, actor, space.id, { ...p1, name: 'third' }, { baseRevision: 2 });
    const rows = await PlanRevision.findAll({ where: { spaceId: space.id }, order: [['revision', 'ASC']] });
    expect(rows.map((r) => [r.revision, (r.plan as { name: string }).name])).toEqual([
      [1, 'Garage loft'],
      [2, 'second'],
      [3, 'third'],
    ]);
    expect((await latestRevision(space.id))?.revision).toBe(3);
  });

  it('refuses a save based on a stale revision (409)', async () => {
    const { space } = await createJob(org);
    const actor = {
      id: org.office.id,
      email: org.office.email,
      name: org.office.name,
      role: 'office' as const,
      organisationId: org.id,
      organisationName: org.name,
    };
    const seq = PlanRevision.sequelize!;
    await addPlanRevision(seq, actor, space.id, parsePlanOr422(plan), { baseRevision: 0 });
    await expect(addPlanRevision(seq, actor, space.id, parsePlanOr422(plan), { baseRevision: 0 })).rejects.toMatchObject({
      status: 409,
      code: 'revision_conflict',
    });
  });

  it('gives concurrent saves distinct revision numbers', async () => {
    const { space } = await createJob(org);
    const actor = {
      id: org.office.id,
      email: org.office.email,
      name: org.office.name,
      role: 'office' as const,
      organisationId: org.id,
      organisationName: org.name,
    };
    const seq = PlanRevision.sequelize!;
    await Promise.all([1, 2, 3, 4].map(() => addPlanRevision(seq, actor, space.id, parsePlanOr422(plan))));
    const revs = (await PlanRevision.findAll({ where: { spaceId: space.id } })).map((r) => r.revision).sort();
    expect(revs).toEqual([1, 2, 3, 4]);
  });
});

it('the example plans the seed uses exist and parse (examples/)', () => {
  const dir = path.resolve(__dirname, '../../examples');
  const valid = fs
    .readdirSync(dir)
    .filter((f) => f.endsWith('.json'))
    .filter((f) => {
      try {
        parsePlanOr422(JSON.parse(fs.readFileSync(path.join(dir, f), 'utf8')));
        return true;
      } catch {
        return false;
      }
    });
  expect(valid.length).toBeGreaterThan(0);
});

describe('latest revisions (one repository)', () => {
  it('gives the latest revision of each space in one call, skipping spaces without a plan', async () => {
    const a = await createJob(org);
    const b = await createJob(org);
    const actor = { id: org.office.id, organisationId: org.id };
    const seq = PlanRevision.sequelize!;
    const p = parsePlanOr422(plan);
    await addPlanRevision(seq, actor, a.space.id, p);
    await addPlanRevision(seq, actor, a.space.id, { ...p, name: 'a2' });
    await addPlanRevision(seq, actor, b.space.id, { ...p, name: 'b1' });
    const empty = await createJob(org);
    const m = await latestRevisions([a.space.id, b.space.id, empty.space.id]);
    expect([...m.keys()].sort()).toEqual([a.space.id, b.space.id].sort());
    expect([m.get(a.space.id)?.revision, (m.get(a.space.id)?.plan as Plan).name]).toEqual([2, 'a2']);
    expect([m.get(b.space.id)?.revision, (m.get(b.space.id)?.plan as Plan).name]).toEqual([1, 'b1']);
    const light = await latestRevisions([a.space.id], { bodies: false });
    expect(light.get(a.space.id)?.revision).toBe(2);
    expect(light.get(a.space.id)?.plan).toBeUndefined();
  });
});
