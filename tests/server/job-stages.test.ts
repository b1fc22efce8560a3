// A job moves by hand only along the allowed stage moves (shared/api/job-stages.ts), checked
// against the stage it is at when the move is written: of two moves at once, one wins.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JOB_STAGES, type JobStage } from '../../shared/api/jobs';
import { allowedStageMoves, OFFICE_STAGE_OVERRIDES, STAGE_MOVES } from '../../shared/api/job-stages';
import { Job, JobEvent } from '../../server/db/models';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => ctx?.close());

const stageEvents = (jobId: string) => JobEvent.count({ where: { jobId, kind: 'stage_changed' } });

describe('the stage table', () => {
  it('lists every stage and never a move to the same stage', () => {
    expect(Object.keys(STAGE_MOVES).sort()).toEqual([...JOB_STAGES].sort());
    for (const s of JOB_STAGES) expect(allowedStageMoves(s, 'office')).not.toContain(s);
  });

  it('gives the office its overrides and no one else', () => {
    expect(allowedStageMoves('declined', 'estimator')).toEqual([]);
    expect(allowedStageMoves('declined', 'office')).toEqual(OFFICE_STAGE_OVERRIDES.declined);
    expect(allowedStageMoves('scheduled', 'estimator')).not.toContain('declined');
  });
});

describe('moving a job by hand', () => {
  it('refuses a jump with 409 naming from and to, and changes nothing', async () => {
    const { job } = await createJob(org, { stage: 'surveyed' });
    const estimator = await loginAs(ctx.app, org.estimator);
    const res = await estimator.patch(`/api/jobs/${job.id}`).send({ stage: 'closed' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('stage_not_allowed');
    expect(res.body.error.message).toMatch(/from surveyed to closed/);
    expect(res.body.error.details[0].path).toBe('stage');
    expect((await Job.findByPk(job.id))!.stage).toBe('surveyed');
    expect(await stageEvents(job.id)).toBe(0);
    expect((await estimator.patch(`/api/jobs/${job.id}`).send({ stage: 'quoted' })).status).toBe(200);
  });

  it('lets the office reopen a declined job, and not an estimator', async () => {
    const { job } = await createJob(org, { stage: 'declined' });
    const estimator = await loginAs(ctx.app, org.estimator);
    const office = await loginAs(ctx.app, org.office);
    expect((await estimator.patch(`/api/jobs/${job.id}`).send({ stage: 'enquiry' })).status).toBe(409);
    const reopened = await office.patch(`/api/jobs/${job.id}`).send({ stage: 'enquiry' });
    expect(reopened.status).toBe(200);
    expect(reopened.body.job.stage).toBe('enquiry');
  });

  it('of two moves at once from one stage, exactly one wins', async () => {
    const estimator = await loginAs(ctx.app, org.estimator);
    for (let trial = 0; trial < 6; trial += 1) {
      const { job } = await createJob(org, { stage: 'surveyed' });
      // From surveyed both are allowed; from either result the other is not.
      const targets: JobStage[] = ['quoted', 'enquiry'];
      const answers = await Promise.all(targets.map((stage) => estimator.patch(`/api/jobs/${job.id}`).send({ stage })));
      const won = answers.filter((a) => a.status === 200);
      expect(won).toHaveLength(1);
      expect(answers.find((a) => a.status !== 200)!.status).toBe(409);
      expect((await Job.findByPk(job.id))!.stage).toBe(won[0].body.job.stage);
      expect(await stageEvents(job.id)).toBe(1);
    }
  });

  it('writes the move only if the job is still at the stage it was checked against', async () => {
    const { job } = await createJob(org, { stage: 'surveyed' });
    const estimator = await loginAs(ctx.app, org.estimator);
    // Another writer moves the job between the check and the write (outside the request's transaction).
    const sneak = async () => {
      Job.removeHook('beforeBulkUpdate', 'sneak');
      await ctx.deps.sequelize.query(`UPDATE jobs SET stage = 'declined' WHERE id = :id`, { replacements: { id: job.id } });
    };
    Job.addHook('beforeBulkUpdate', 'sneak', sneak);
    try {
      const res = await estimator.patch(`/api/jobs/${job.id}`).send({ stage: 'quoted' });
      expect(res.status).toBe(409);
      expect(res.body.error.code).toBe('stage_changed');
    } finally {
      Job.removeHook('beforeBulkUpdate', 'sneak');
    }
    expect((await Job.findByPk(job.id))!.stage).toBe('declined');
    expect(await stageEvents(job.id)).toBe(0);
  });
});
