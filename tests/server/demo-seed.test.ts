// The demo seed: two invented companies, users per role, jobs over every stage, plans from examples/.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JOB_STAGES } from '../../shared/api/jobs';
import { Invoice, Job, Organisation, PlanRevision, Quote, Space, User } from '../../server/db/models';
import { DEMO_COMPANY, DEMO_PASSWORD, OTHER_COMPANY, loadExamplePlans, seedDemo } from '../../server/db/seeders/demo';
import { createTestContext, loginAs, type TestContext } from '../helpers/test-app';

let ctx: TestContext;

beforeAll(async () => {
  ctx = await createTestContext();
  // Another test file may have seeded already (one database per run); both cases are fine.
  await seedDemo(ctx.deps);
});
afterAll(async () => ctx?.close());

describe('demo seed', () => {
  it('is idempotent: a second run creates nothing', async () => {
    const before = { orgs: await Organisation.count(), users: await User.count(), jobs: await Job.count() };
    expect(await seedDemo(ctx.deps)).toBe(false);
    expect({ orgs: await Organisation.count(), users: await User.count(), jobs: await Job.count() }).toEqual(before);
  });

  it('lets each demo role sign in with the demo password', async () => {
    for (const email of ['office@demo.example.com', 'estimator@demo.example.com', 'installer@demo.example.com']) {
      const res = await request(ctx.app).post('/api/auth/login').send({ email, password: DEMO_PASSWORD });
      expect(res.status, email).toBe(200);
      expect(res.body.user.organisation.name).toBe(DEMO_COMPANY);
    }
  });

  it('spreads about ten jobs over every stage, some for each installer, each with a space and a plan', async () => {
    const office = await loginAs(ctx.app, { email: 'office@demo.example.com', password: DEMO_PASSWORD });
    const jobs = (await office.get('/api/jobs')).body.jobs as Array<{
      stage: string;
      assignedInstaller: { name: string } | null;
      spaces: Array<{ latestRevision: number | null }>;
    }>;
    expect(jobs.length).toBeGreaterThanOrEqual(10);
    expect(new Set(jobs.map((j) => j.stage))).toEqual(new Set(JOB_STAGES));
    expect(new Set(jobs.map((j) => j.assignedInstaller?.name).filter(Boolean)).size).toBe(2);
    for (const j of jobs) {
      expect(j.spaces.length).toBeGreaterThan(0);
      for (const s of j.spaces) expect(s.latestRevision).toBe(1);
    }
  });

  it('books installer and date only from the scheduled stage on (an accepted job waits on the schedule)', async () => {
    const office = await loginAs(ctx.app, { email: 'office@demo.example.com', password: DEMO_PASSWORD });
    const jobs = (await office.get('/api/jobs')).body.jobs as Array<{
      reference: string;
      stage: string;
      assignedInstaller: { id: string } | null;
      installDate: string | null;
    }>;
    const booked = new Set(['scheduled', 'installed', 'closed']);
    for (const j of jobs) {
      const has = { installer: j.assignedInstaller !== null, date: j.installDate !== null };
      expect(has, `${j.reference} (${j.stage})`).toEqual(booked.has(j.stage) ? { installer: true, date: true } : { installer: false, date: false });
    }
    // The schedule lists every accepted job as waiting; the installer's own list holds only booked jobs.
    const week = (await office.get('/api/schedule')).body as { unscheduled: Array<{ reference: string }> };
    expect(week.unscheduled.map((j) => j.reference).sort()).toEqual(
      jobs
        .filter((j) => j.stage === 'accepted')
        .map((j) => j.reference)
        .sort(),
    );
  });

  it('takes its plans from the valid examples (the invalid one is skipped)', async () => {
    const examples = loadExamplePlans();
    expect(examples.length).toBeGreaterThan(0);
    expect(examples.map((e) => e.file)).not.toContain('invalid-crossed-outline.json');
    const org = await Organisation.findOne({ where: { name: DEMO_COMPANY } });
    const revs = await PlanRevision.findAll({ where: { organisationId: org!.id } });
    const outlines = new Set(examples.map((e) => JSON.stringify(e.plan.outline)));
    for (const r of revs) expect(outlines.has(JSON.stringify((r.plan as { outline: unknown }).outline))).toBe(true);
  });

  it('keeps the second company apart', async () => {
    const installer = await loginAs(ctx.app, { email: 'installer@demo.example.com', password: DEMO_PASSWORD });
    const mine = (await installer.get('/api/jobs')).body.jobs;
    expect(mine.length).toBeGreaterThan(0);
    for (const j of mine) expect(j.assignedInstaller.name).toBe('Ian Calder');
    const other = await Organisation.findOne({ where: { name: OTHER_COMPANY } });
    const otherSpace = await Space.findOne({ where: { organisationId: other!.id } });
    const office = await loginAs(ctx.app, { email: 'office@demo.example.com', password: DEMO_PASSWORD });
    expect((await office.get(`/api/spaces/${otherSpace!.id}`)).status).toBe(404);
  });

  it('gives each job the quote and invoice its stage implies (a quoted job has a sent quote, a closed one a paid invoice)', async () => {
    const org = (await Organisation.findOne({ where: { name: DEMO_COMPANY } }))!;
    const expected: Record<string, { quote: string | null; invoice: string | null }> = {
      enquiry: { quote: null, invoice: null },
      surveyed: { quote: null, invoice: null },
      quoted: { quote: 'sent', invoice: null },
      declined: { quote: 'declined', invoice: null },
      accepted: { quote: 'accepted', invoice: null },
      scheduled: { quote: 'accepted', invoice: null },
      installed: { quote: 'accepted', invoice: null },
      closed: { quote: 'accepted', invoice: 'paid' },
    };
    for (const job of await Job.findAll({ where: { organisationId: org.id } })) {
      const quotes = await Quote.findAll({ where: { jobId: job.id } });
      const invoices = await Invoice.findAll({ where: { jobId: job.id, kind: 'invoice' } });
      const got = {
        quote: quotes.length ? quotes.map((q) => q.status).join(',') : null,
        invoice: invoices.length ? invoices.map((i) => i.status).join(',') : null,
      };
      expect(got, `${job.reference} (${job.stage})`).toEqual(expected[job.stage]);
    }
  });

  it('gives the finished demo jobs invented actuals, so the report and its suggestions show something', async () => {
    const office = await loginAs(ctx.app, { email: 'office@demo.example.com', password: DEMO_PASSWORD });
    const res = await office.get(`/api/reports/estimate-vs-actual?from=2000-01-01&to=2100-12-31`);
    expect(res.status).toBe(200);
    const finished = await Job.count({
      where: { organisationId: (await Organisation.findOne({ where: { name: DEMO_COMPANY } }))!.id, stage: ['installed', 'closed'] },
    });
    expect(res.body.summary.jobsCounted).toBe(finished);
    expect(res.body.summary.suggestions.waste).not.toBeNull();
    expect(res.body.summary.suggestions.laying).not.toBeNull();
    expect(res.body.rows.every((r: { usedRolls: number | null; actualHours: number | null }) => r.usedRolls !== null && r.actualHours !== null)).toBe(true);
  });
});
