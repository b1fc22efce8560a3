// Correcting what was used after finishing (PUT /api/jobs/:id/actuals): who may, until when, the
// version guard that keeps two corrections from losing one, and the report and job page after it.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mayEditActuals } from '../../shared/api/actuals';
import { CompanySetting, Invoice, Job, JobActual, JobEvent } from '../../server/db/models';
import { createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { readyToFinish } from './job-sheet-fixtures';

let ctx: TestContext;
let org: TestOrg;
const today = new Date().toISOString().slice(0, 10);

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => {
  await ctx?.close();
});

type Agent = Awaited<ReturnType<typeof loginAs>>;

/** A job the installer finished with 6 rolls of each product used (1 back), 5 hours, one hatch kit. */
async function finished(installer: Agent, withActuals = true) {
  const made = await readyToFinish(org, installer);
  const actuals = {
    rolls: made.productIds.map((productId) => ({ productId, used: 6, returned: 1 })),
    hours: [{ userId: org.installer.id, hours: 5 }],
    extras: [{ code: 'hatch_kit', used: 1 }],
  };
  const res = await installer.post(`/api/jobs/${made.job.id}/finish`).send(withActuals ? { actuals } : {});
  expect(res.status).toBe(200);
  return { ...made, actuals };
}

const put = (agent: Agent, jobId: string, body: object) => agent.put(`/api/jobs/${jobId}/actuals`).send(body);

describe('PUT /api/jobs/:id/actuals', () => {
  it("lets the office correct them: version moves on, who and when are kept, the job's history has before and after, the job page and report show the new figures", async () => {
    const installer = await loginAs(ctx.app, org.installer);
    const office = await loginAs(ctx.app, org.office);
    const { job, actuals, productIds } = await finished(installer);
    const before = (await office.get(`/api/jobs/${job.id}/estimate-vs-actual`)).body;
    expect(before.actuals).toMatchObject({ version: 1, edited: null, recorded: { by: org.installer.name } });
    expect(before.editable).toBe(true);
    const usedBefore = before.comparison.usedRolls;

    const corrected = { ...actuals, rolls: actuals.rolls.map((r) => ({ ...r, used: 8, returned: 0 })) };
    const res = await put(office, job.id, { actuals: corrected, expectedVersion: 1 });
    expect(res.status).toBe(200);
    expect(res.body.actuals).toMatchObject({ version: 2, recorded: { by: org.installer.name }, edited: { by: org.office.name } });
    expect(Date.parse(res.body.actuals.edited.at)).toBeGreaterThanOrEqual(Date.parse(res.body.actuals.recorded.at));

    const row = (await JobActual.findByPk(job.id))!;
    expect(row.rolls).toEqual(corrected.rolls);
    expect(row).toMatchObject({ version: 2, editedById: org.office.id, recordedById: org.installer.id });
    const events = await JobEvent.findAll({ where: { jobId: job.id, kind: 'actuals_edited' } });
    expect(events).toHaveLength(1);
    expect(events[0].userId).toBe(org.office.id);
    expect(events[0].data).toMatchObject({ version: 2, before: { rolls: actuals.rolls }, after: { rolls: corrected.rolls } });
    expect(String(events[0].data.text)).toBe('What was used corrected: rolls');

    const after = (await office.get(`/api/jobs/${job.id}/estimate-vs-actual`)).body;
    expect(after.comparison.usedRolls).toBe(8 * productIds.length);
    expect(after.comparison.usedRolls).not.toBe(usedBefore);
    expect(after.comparison.returnedRolls).toBe(0);
    const report = (await office.get(`/api/reports/estimate-vs-actual?from=2000-01-01&to=${today}`)).body;
    expect(report.rows.find((r: { jobId: string }) => r.jobId === job.id)).toMatchObject({ usedRolls: 8 * productIds.length, returnedRolls: 0 });
  });

  it('of two corrections made from the same reading, keeps the first and refuses the second with 409, when they race too', async () => {
    const installer = await loginAs(ctx.app, org.installer);
    const office = await loginAs(ctx.app, org.office);
    const { job, actuals } = await finished(installer);
    const theirs = { ...actuals, hours: [{ userId: org.installer.id, hours: 7 }] };
    const mine = { ...actuals, extras: [{ code: 'hatch_kit', used: 2 }] };
    expect((await put(office, job.id, { actuals: theirs, expectedVersion: 1 })).status).toBe(200);
    const stale = await put(installer, job.id, { actuals: mine, expectedVersion: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('actuals_changed');
    expect(stale.body.error.details[0].path).toBe('expectedVersion');
    expect((await JobActual.findByPk(job.id))!.hours).toEqual(theirs.hours);

    // Both at once from version 2: one wins, the other is refused; one change in the history.
    const officeBody = { ...theirs, hours: [{ userId: org.installer.id, hours: 8 }] };
    const [a, b] = await Promise.all([
      put(office, job.id, { actuals: officeBody, expectedVersion: 2 }),
      put(installer, job.id, { actuals: mine, expectedVersion: 2 }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    expect((a.status === 409 ? a : b).body.error.code).toBe('actuals_changed');
    const row = (await JobActual.findByPk(job.id))!;
    expect(row.version).toBe(3);
    const winner = a.status === 200 ? officeBody : mine;
    expect({ rolls: row.rolls, hours: row.hours, extras: row.extras }).toEqual(winner);
    expect(row.editedById).toBe(a.status === 200 ? org.office.id : org.installer.id);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: 'actuals_edited' } })).toBe(2);
  });

  it('lets the installer correct their own finished job until it is invoiced or closed, then only the office', async () => {
    const installer = await loginAs(ctx.app, org.installer);
    const office = await loginAs(ctx.app, org.office);
    const { job, actuals } = await finished(installer);
    const sheet = (await installer.get(`/api/jobs/${job.id}/job-sheet`)).body.sheet;
    expect(sheet.actuals).toMatchObject({ version: 1, editable: true, hours: actuals.hours });
    expect((await put(installer, job.id, { actuals: { ...actuals, hours: [{ userId: org.installer.id, hours: 6 }] }, expectedVersion: 1 })).status).toBe(200);

    await Invoice.create({
      organisationId: org.id,
      jobId: job.id,
      quoteId: null,
      kind: 'invoice',
      series: 'INV',
      seq: 1,
      number: `INV-${job.reference}`,
      creditedInvoiceId: null,
      issueDate: today,
      dueDate: null,
      currency: 'GBP',
      customerName: 'Test customer',
      customerEmail: '',
      billingAddress: [],
      netMinor: 0,
      taxMinor: 0,
      grossMinor: 0,
      depositMinor: 0,
    } as never);
    expect((await installer.get(`/api/jobs/${job.id}/job-sheet`)).body.sheet.actuals.editable).toBe(false);
    const locked = await put(installer, job.id, { actuals, expectedVersion: 2 });
    expect(locked.status).toBe(409);
    expect(locked.body.error.code).toBe('actuals_locked');
    expect((await JobActual.findByPk(job.id))!.version).toBe(2);
    await Job.update({ stage: 'closed' }, { where: { id: job.id } });
    expect((await put(office, job.id, { actuals, expectedVersion: 2 })).status).toBe(200);
  });

  it('records actuals after finishing when none were (expectedVersion 0)', async () => {
    const installer = await loginAs(ctx.app, org.installer);
    const office = await loginAs(ctx.app, org.office);
    const { job, actuals } = await finished(installer, false);
    expect((await office.get(`/api/jobs/${job.id}/estimate-vs-actual`)).body.actuals).toMatchObject({ version: 0, rolls: [] });
    const res = await put(office, job.id, { actuals, expectedVersion: 0 });
    expect(res.status).toBe(200);
    expect(res.body.actuals).toMatchObject({ version: 1, recorded: { by: org.office.name }, edited: null });
    expect((await put(office, job.id, { actuals, expectedVersion: 0 })).body.error.code).toBe('actuals_changed');
    expect(await JobActual.count({ where: { jobId: job.id } })).toBe(1);
  });

  it('refuses estimators, other companies, unfinished jobs, bad figures and emptying a part the company asks for, changing nothing', async () => {
    const installer = await loginAs(ctx.app, org.installer);
    const office = await loginAs(ctx.app, org.office);
    const { job, actuals, productIds } = await finished(installer);
    expect((await put(await loginAs(ctx.app, org.estimator), job.id, { actuals, expectedVersion: 1 })).status).toBe(403);
    expect((await put(await loginAs(ctx.app, (await createOrgWithUsers()).office), job.id, { actuals, expectedVersion: 1 })).status).toBe(404);
    const open = await readyToFinish(org, installer);
    expect((await put(office, open.job.id, { actuals, expectedVersion: 0 })).body.error.code).toBe('job_not_installed');

    const bad = await put(office, job.id, { actuals: { rolls: [{ productId: productIds[0], used: -2 }] }, expectedVersion: 1 });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toContain('actuals.rolls.0.used');
    expect((await put(office, job.id, { actuals })).body.error.details.map((d: { path: string }) => d.path)).toContain('expectedVersion');

    await CompanySetting.update({ actualsRequired: ['hours'] }, { where: { organisationId: org.id } });
    try {
      const emptied = await put(office, job.id, { actuals: { ...actuals, hours: [] }, expectedVersion: 1 });
      expect(emptied.status).toBe(422);
      expect(emptied.body.error.details.map((d: { path: string }) => d.path)).toEqual(['actuals.hours']);
    } finally {
      await CompanySetting.update({ actualsRequired: [] }, { where: { organisationId: org.id } });
    }
    expect((await JobActual.findByPk(job.id))!.version).toBe(1);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: 'actuals_edited' } })).toBe(0);
  });
});

describe('mayEditActuals', () => {
  it('gives the office installed and closed jobs, the installer installed ones not yet invoiced, estimators none', () => {
    expect(mayEditActuals('office', { stage: 'closed', invoiced: true })).toBe(true);
    expect(mayEditActuals('office', { stage: 'scheduled', invoiced: false })).toBe(false);
    expect(mayEditActuals('installer', { stage: 'installed', invoiced: false })).toBe(true);
    expect(mayEditActuals('installer', { stage: 'installed', invoiced: true })).toBe(false);
    expect(mayEditActuals('installer', { stage: 'closed', invoiced: false })).toBe(false);
    expect(mayEditActuals('estimator', { stage: 'installed', invoiced: false })).toBe(false);
  });
});
