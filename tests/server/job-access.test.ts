// Every module asks one rule, can() (shared/auth/policies.ts), through server/modules/jobs/job-access.ts.
// This checks that its list form (jobScope) agrees with it job by job, and that the endpoints of
// different modules answer an installer and an estimator the same way for the same job.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { can } from '../../shared/auth/policies';
import { Job } from '../../server/db/models';
import { jobScope } from '../../server/modules/jobs/job-access';
import { createJob, createTestContext, createUser, loginAs, type TestContext, type TestOrg, createOrgWithUsers } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;
let other: TestOrg;
const jobs: Record<string, { id: string; spaceId: string }> = {};

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers();
  other = await createOrgWithUsers();
  const colleague = await createUser(org.id, 'installer');
  const make = async (key: string, o: TestOrg, stage: 'accepted' | 'scheduled', installerId: string | null) => {
    const made = await createJob(o, { stage, assignedInstallerId: installerId });
    jobs[key] = { id: made.job.id, spaceId: made.space.id };
  };
  await make('mine', org, 'scheduled', org.installer.id);
  await make('mineNotYetScheduled', org, 'accepted', org.installer.id);
  await make('colleagues', org, 'scheduled', colleague.id);
  await make('unassigned', org, 'accepted', null);
  await make('foreign', other, 'scheduled', other.installer.id);
});
afterAll(async () => {
  await ctx?.close();
});

describe('one job-access rule', () => {
  it('lists exactly the jobs can() lets each user see', async () => {
    const all = await Job.findAll({ where: { id: Object.values(jobs).map((j) => j.id) } });
    for (const u of [org.office, org.estimator, org.installer]) {
      const actor = { id: u.id, role: u.role, organisationId: u.organisationId, email: u.email, name: u.name };
      const listed = (await Job.findAll({ where: { ...jobScope(actor as never), id: all.map((j) => j.id) } })).map((j) => j.id).sort();
      const allowed = all
        .filter((j) => can(actor, 'jobs:read', j))
        .map((j) => j.id)
        .sort();
      expect(listed, u.role).toEqual(allowed);
    }
  });

  it('answers the installer the same through the jobs, spaces, plans and job-sheet modules', async () => {
    const installer = await loginAs(ctx.app, org.installer);
    const expected: Record<string, number> = { mine: 200, mineNotYetScheduled: 200, colleagues: 404, unassigned: 404, foreign: 404 };
    for (const [key, j] of Object.entries(jobs)) {
      const statuses = [
        (await installer.get(`/api/jobs/${j.id}`)).status,
        (await installer.get(`/api/jobs/${j.id}/events`)).status,
        (await installer.get(`/api/spaces/${j.spaceId}`)).status,
        (await installer.get(`/api/spaces/${j.spaceId}/plan`)).status,
        (await installer.get(`/api/jobs/${j.id}/job-sheet`)).status,
      ];
      expect(statuses, key).toEqual(Array(5).fill(expected[key]));
    }
  });

  it('lets the estimator read every job of the company but not record site work (403), and hides other companies (404)', async () => {
    const estimator = await loginAs(ctx.app, org.estimator);
    expect((await estimator.get(`/api/jobs/${jobs.colleagues.id}/job-sheet`)).status).toBe(200);
    const note = await estimator.post(`/api/jobs/${jobs.mine.id}/notes`).send({ text: 'Checked the hatch size' });
    expect(note.status).toBe(403);
    expect((await estimator.get(`/api/jobs/${jobs.foreign.id}/job-sheet`)).status).toBe(404);
    const office = await loginAs(ctx.app, org.office);
    expect((await office.post(`/api/jobs/${jobs.mine.id}/notes`).send({ text: 'Customer will leave the key' })).status).toBe(201);
  });
});
