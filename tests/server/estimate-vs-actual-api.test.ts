import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Job, JobActual, JobCompletion, PlanRevision, SettingsChange } from '../../server/db/models';
import { seedDemoCatalogue } from '../../server/modules/settings/settings.service';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { examplePlan, scheduledJobWithTakeoff } from './job-sheet-fixtures';

let ctx: TestContext;
let org: TestOrg;
const today = new Date().toISOString().slice(0, 10);
const period = `from=2000-01-01&to=${today}`;

/** A job finished today with the given actuals, as the finish would have stored them. */
async function finishedJob(rollsExtra: number, hours: number) {
  const made = await scheduledJobWithTakeoff(org);
  const productIds = [...new Set(made.takeoff.layers.map((l) => l.productId))];
  await Job.update({ stage: 'installed' }, { where: { id: made.job.id } });
  await JobCompletion.create({ jobId: made.job.id, organisationId: org.id, userId: org.installer.id, completedAt: new Date(), handoverKey: null });
  const rolls = productIds.map((productId) => {
    const packing = made.takeoff.layers.filter((l) => l.productId === productId).reduce((a, l) => a + l.rollsByPacking, 0);
    return { productId, used: packing + rollsExtra, returned: 1 };
  });
  await JobActual.create({
    jobId: made.job.id,
    organisationId: org.id,
    rolls,
    hours: [{ userId: org.installer.id, hours }],
    extras: [],
    recordedById: org.installer.id,
    recordedAt: new Date(),
  });
  return { ...made, rolls };
}

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  await seedDemoCatalogue(org.id);
  for (const [extra, hours] of [
    [1, 9],
    [1, 11],
    [2, 10],
  ])
    await finishedJob(extra, hours);
});
afterAll(async () => {
  await ctx?.close();
});

describe('GET /api/reports/estimate-vs-actual', () => {
  it('is refused to installers and estimators, and to nobody signed in', async () => {
    for (const who of [org.installer, org.estimator]) {
      const agent = await loginAs(ctx.app, who);
      expect((await agent.get(`/api/reports/estimate-vs-actual?${period}`)).status, who.role).toBe(403);
      expect((await agent.get('/api/reports/suggestions')).status, who.role).toBe(403);
      expect((await agent.post('/api/reports/suggestions/apply').send({ kind: 'waste-allowance', expectedPct: 12 })).status, who.role).toBe(403);
    }
    const agent = await loginAs(ctx.app, org.installer);
    const job = (await Job.findOne({ where: { organisationId: org.id, stage: 'installed' } }))!;
    expect((await agent.get(`/api/jobs/${job.id}/estimate-vs-actual`)).status).toBe(403);
    const res = await request(ctx.app).get(`/api/reports/estimate-vs-actual?${period}`);
    expect(res.status).toBe(401);
  });

  it('answers per-job rows and a summary for the office, only for the period asked', async () => {
    const agent = await loginAs(ctx.app, org.office);
    const res = await agent.get(`/api/reports/estimate-vs-actual?${period}`);
    expect(res.status).toBe(200);
    expect(res.body.rows).toHaveLength(3);
    for (const r of res.body.rows) {
      expect(Object.keys(r)).toEqual(expect.arrayContaining(['jobId', 'reference', 'estimatedRolls', 'usedRolls', 'estimatedHours', 'actualHours']));
      expect(r.usedRolls).toBeGreaterThan(r.estimatedRolls);
    }
    expect(res.body.summary.jobsCounted).toBe(3);
    expect(res.body.summary.usedRolls).toBe(res.body.rows.reduce((a: number, r: { usedRolls: number }) => a + r.usedRolls, 0));
    expect(res.body.summary.suggestedWasteAllowancePct).toBeGreaterThan(10);
    const none = await agent.get('/api/reports/estimate-vs-actual?from=2000-01-01&to=2000-12-31');
    expect(none.body.summary.jobsCounted).toBe(0);
    const bad = await agent.get('/api/reports/estimate-vs-actual?from=2026-13-01&to=2026-01-01');
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toContain('from');
  });

  it('shows the office one job against its estimate', async () => {
    const agent = await loginAs(ctx.app, org.office);
    const job = (await Job.findOne({ where: { organisationId: org.id, stage: 'installed' } }))!;
    const res = await agent.get(`/api/jobs/${job.id}/estimate-vs-actual`);
    expect(res.status).toBe(200);
    expect(res.body.finished).toBe(true);
    expect(res.body.comparison.products.length).toBeGreaterThan(0);
    expect(res.body.comparison.actualHours).toBeGreaterThan(0);
  });
});

describe('applying a suggestion', () => {
  it('sets the waste allowance, records who and when, and the next saved plan’s takeoff uses it', async () => {
    const estimator = await loginAs(ctx.app, org.estimator);
    const { job, space } = await createJob(org, { stage: 'surveyed' });
    expect((await estimator.put(`/api/spaces/${space.id}/plan`).send({ plan: examplePlan(), baseRevision: 0 })).status).toBe(201);
    const before = await PlanRevision.findOne({ where: { spaceId: space.id, revision: 1 } });
    expect((before?.takeoff as { wasteAllowancePct: number }).wasteAllowancePct).toBe(10);

    const office = await loginAs(ctx.app, org.office);
    const s = (await office.get('/api/reports/suggestions?last=20')).body.suggestions;
    const pct = s.waste.suggestedPct;
    expect(pct).not.toBe(10);
    expect((await office.post('/api/reports/suggestions/apply').send({ kind: 'waste-allowance', expectedPct: pct - 0.5 })).status).toBe(409);
    const applied = await office.post('/api/reports/suggestions/apply').send({ kind: 'waste-allowance', expectedPct: pct });
    expect(applied.status).toBe(200);
    const change = await SettingsChange.findOne({ where: { organisationId: org.id, setting: 'wasteAllowance' } });
    expect(change?.userId).toBe(org.office.id);
    expect([change?.oldValue, change?.newValue]).toEqual([0.1, pct / 100]);
    expect((await office.get('/api/reports/suggestions')).body.history[0]).toMatchObject({ setting: 'wasteAllowance', by: expect.any(String) });

    expect((await estimator.put(`/api/spaces/${space.id}/plan`).send({ plan: examplePlan(), baseRevision: 1 })).status).toBe(201);
    const after = await PlanRevision.findOne({ where: { spaceId: space.id, revision: 2 } });
    expect((after?.takeoff as { wasteAllowancePct: number }).wasteAllowancePct).toBeCloseTo(pct, 9);
    expect(job.id).toBeTruthy();
  });

  it('sets the laying rates from the hours recorded', async () => {
    const office = await loginAs(ctx.app, org.office);
    const s = (await office.get('/api/reports/suggestions')).body.suggestions;
    expect(s.laying).not.toBeNull();
    const res = await office.post('/api/reports/suggestions/apply').send({ kind: 'laying-rates', expected: s.laying.suggested });
    expect(res.status).toBe(200);
    const settings = (await office.get('/api/settings')).body;
    const labour = settings.settings?.labour ?? settings.labour;
    expect([labour.baseM2PerHour, labour.crossM2PerHour]).toEqual([s.laying.suggested.baseM2PerHour, s.laying.suggested.crossM2PerHour]);
  });
});
