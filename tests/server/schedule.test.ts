import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PlanRevision } from '../../server/db/models';
import { addDaysIso as addDays, formatDate, mondayOf } from '../../shared/dates';
import { isOverCapacity } from '../../server/modules/schedule/schedule.service';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { examplePlan, exampleProducts } from './job-sheet-fixtures';

let ctx: TestContext;
let org: TestOrg;
const nextMonday = addDays(mondayOf(new Date().toISOString().slice(0, 10)), 7);
const tuesday = addDays(nextMonday, 1);

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => {
  await ctx?.close();
});

async function acceptedJob(customerEmail = '') {
  const plan = examplePlan();
  const made = await createJob(org, { stage: 'accepted', plan });
  await PlanRevision.update(
    { takeoff: JSON.parse(JSON.stringify(computeTakeoff(plan, { products: exampleProducts() }))) },
    { where: { spaceId: made.space.id } },
  );
  if (customerEmail) await made.customer.update({ email: customerEmail });
  return made;
}

describe('week arithmetic', () => {
  it.each([
    ['2027-01-04', '2027-01-04'], // a Monday stays
    ['2027-01-10', '2027-01-04'], // Sunday belongs to the week that began on Monday
    ['2027-01-01', '2026-12-28'], // across a year end
  ])('puts %s in the week of %s', (d, monday) => expect(mondayOf(d)).toBe(monday));

  it('calls a day over capacity by job count or by area', () => {
    const cap = { maxJobsPerDay: 1, maxAreaM2PerDay: 100 };
    expect(isOverCapacity({ jobs: 1, areaM2: 100 }, cap)).toBe(false);
    expect(isOverCapacity({ jobs: 2, areaM2: 20 }, cap)).toBe(true);
    expect(isOverCapacity({ jobs: 1, areaM2: 100.5 }, cap)).toBe(true);
  });
});

describe('scheduling', () => {
  it('books an accepted job: stage scheduled, the customer told the date and how to prepare, the installer sent the sheet link', async () => {
    const { job } = await acceptedJob('robin.hale@example.com');
    const office = await loginAs(ctx.app, org.office);
    const week = await office.get('/api/schedule').query({ weekStart: tuesday });
    expect(week.status).toBe(200);
    expect(week.body.weekStart).toBe(nextMonday);
    expect(week.body.days).toHaveLength(7);
    expect(week.body.unscheduled.map((j: { id: string }) => j.id)).toContain(job.id);
    expect(week.body.installers.map((i: { id: string }) => i.id)).toContain(org.installer.id);

    ctx.outbox.clear();
    const res = await office.post('/api/schedule/assign').send({ jobId: job.id, installerId: org.installer.id, date: tuesday });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ stage: 'scheduled', installDate: tuesday, installerId: org.installer.id, warnings: [] });

    const toCustomer = await ctx.outbox.waitFor((m) => m.to.includes('robin.hale@example.com'));
    expect(toCustomer.text).toMatch(/Clear the area under the loft hatch/);
    expect(toCustomer.text).toMatch(/never insulat|No insulation is laid beneath the cold water tank/i);
    // The app's one date style, with the weekday: "Tue, 8 Dec 2026".
    const [y, m, d] = tuesday.split('-').map(Number);
    const month = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sept', 'Oct', 'Nov', 'Dec'][m - 1];
    expect(toCustomer.text).toContain(`Tue, ${d} ${month} ${y}`);
    const toInstaller = await ctx.outbox.waitFor((m) => m.to.includes(org.installer.email));
    expect(toInstaller.links).toContain(`${ctx.config.appUrl}/jobs/${job.id}/sheet`);

    const after = await office.get('/api/schedule').query({ weekStart: nextMonday });
    const booked = after.body.jobs.find((j: { id: string }) => j.id === job.id);
    expect(booked).toMatchObject({ installDate: tuesday, installerId: org.installer.id });
    expect(after.body.loads.find((l: { installerId: string; date: string }) => l.installerId === org.installer.id && l.date === tuesday)).toMatchObject({
      jobs: 1,
      overCapacity: false,
    });

    const installer = await loginAs(ctx.app, org.installer);
    expect((await installer.get('/api/my-jobs')).body.jobs.map((j: { id: string }) => j.id)).toContain(job.id);
  });

  it('warns before a second job on the same installer-day and books it only when told to', async () => {
    const second = await acceptedJob();
    const office = await loginAs(ctx.app, org.office);
    const refused = await office.post('/api/schedule/assign').send({ jobId: second.job.id, installerId: org.installer.id, date: tuesday });
    expect(refused.status).toBe(409);
    expect(refused.body.error.code).toBe('over_capacity');
    expect(refused.body.error.message).toMatch(/would have 2 jobs/);
    // The date as people write it, not ISO: "on 8 Dec 2026".
    expect(refused.body.error.message).toContain(`on ${formatDate(tuesday)};`);
    expect(refused.body.error.message).not.toContain(tuesday);

    const forced = await office
      .post('/api/schedule/assign')
      .send({ jobId: second.job.id, installerId: org.installer.id, date: tuesday, allowOverCapacity: true });
    expect(forced.status).toBe(200);
    expect(forced.body.warnings.join(' ')).toMatch(/would have 2 jobs/);
    const week = await office.get('/api/schedule').query({ weekStart: nextMonday });
    expect(week.body.loads.find((l: { date: string; installerId: string }) => l.date === tuesday && l.installerId === org.installer.id)).toMatchObject({
      jobs: 2,
      overCapacity: true,
    });
  });

  it('follows the capacity setting, and only the office books', async () => {
    const office = await loginAs(ctx.app, org.office);
    const set = await office.patch('/api/schedule/settings').send({ maxJobsPerDay: 3 });
    expect(set.status).toBe(200);
    expect(set.body.settings.maxJobsPerDay).toBe(3);
    const third = await acceptedJob();
    expect((await office.post('/api/schedule/assign').send({ jobId: third.job.id, installerId: org.installer.id, date: tuesday })).status).toBe(200);

    const fourth = await acceptedJob();
    const estimator = await loginAs(ctx.app, org.estimator);
    expect((await estimator.post('/api/schedule/assign').send({ jobId: fourth.job.id, installerId: org.installer.id, date: tuesday })).status).toBe(403);
    const installer = await loginAs(ctx.app, org.installer);
    expect((await installer.get('/api/schedule')).status).toBe(403);
    expect((await office.post('/api/schedule/assign').send({ jobId: fourth.job.id, installerId: org.office.id, date: tuesday })).status).toBe(422);
    expect((await office.post('/api/schedule/assign').send({ jobId: fourth.job.id, installerId: org.installer.id, date: '2020-01-01' })).status).toBe(422);
    const enquiry = await createJob(org, { stage: 'enquiry' });
    expect((await office.post('/api/schedule/assign').send({ jobId: enquiry.job.id, installerId: org.installer.id, date: tuesday })).body.error.code).toBe(
      'wrong_stage',
    );
  });
  it('records the booking on the job history as the jobs module does: stage change, installer assigned, date set', async () => {
    const { job } = await acceptedJob();
    const office = await loginAs(ctx.app, org.office);
    const thursday = addDays(nextMonday, 3);
    const booked = await office.post('/api/schedule/assign').send({ jobId: job.id, installerId: org.installer.id, date: thursday, allowOverCapacity: true });
    expect(booked.status).toBe(200);
    type Ev = { kind: string; data: Record<string, unknown>; user: { id: string } | null };
    const events = (await office.get(`/api/jobs/${job.id}/events`)).body.events as Ev[];
    expect(events.filter((e) => e.kind === 'stage_changed')).toEqual([
      expect.objectContaining({ data: { from: 'accepted', to: 'scheduled' }, user: expect.objectContaining({ id: org.office.id }) }),
    ]);
    expect(events.filter((e) => e.kind === 'assigned')).toEqual([expect.objectContaining({ data: { from: null, to: org.installer.id } })]);
    expect(events.filter((e) => e.kind === 'scheduled')).toEqual([
      expect.objectContaining({ data: expect.objectContaining({ date: thursday, installerId: org.installer.id }) }),
    ]);

    // Moving the booking to another day with the same installer: a new date, but no second stage or assignment line.
    const friday = addDays(nextMonday, 4);
    expect(
      (await office.post('/api/schedule/assign').send({ jobId: job.id, installerId: org.installer.id, date: friday, allowOverCapacity: true })).status,
    ).toBe(200);
    const again = (await office.get(`/api/jobs/${job.id}/events`)).body.events as Ev[];
    expect(again.filter((e) => e.kind === 'stage_changed')).toHaveLength(1);
    expect(again.filter((e) => e.kind === 'assigned')).toHaveLength(1);
    expect(again.filter((e) => e.kind === 'scheduled').map((e) => e.data.date)).toEqual([thursday, friday]);
  });
});
