// The demo jobs' histories read like real ones: the stages walked one allowed move at a time, each
// document at the stage it belongs to, the documents' own dates the same as their history's.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { STAGE_MOVES } from '../../shared/api/job-stages';
import type { JobEvent as JobEventDto, JobStage } from '../../shared/api/jobs';
import { Invoice, Job, JobCompletion, Organisation, Quote } from '../../server/db/models';
import { DEMO_COMPANY, DEMO_PASSWORD, OTHER_COMPANY, seedDemo } from '../../server/db/seeders/demo';
import { createTestContext, loginAs, type TestContext } from '../helpers/test-app';

let ctx: TestContext;

beforeAll(async () => {
  ctx = await createTestContext();
  // Another test file may have seeded already (one database per run); both cases are fine.
  await seedDemo(ctx.deps);
});
afterAll(async () => ctx?.close());

/** What an event needs before it: the stages the job may be at, and an event that must have come first. */
const NEEDS: Record<string, { at?: JobStage[]; after?: string }> = {
  quote_created: { at: ['enquiry', 'surveyed', 'quoted'] },
  quote_sent: { after: 'quote_created' },
  quote_accepted: { at: ['quoted'], after: 'quote_sent' },
  // The customer's decline moves the job first, then records the answer (public-quote.service).
  quote_declined: { at: ['declined'], after: 'quote_sent' },
  assigned: { at: ['scheduled'] },
  scheduled: { at: ['scheduled'] },
  invoice_issued: { at: ['installed'] },
  invoice_paid: { after: 'invoice_issued' },
};
/** The event that moves a job into a stage itself, which must come before the move. */
const MOVED_BY: Partial<Record<JobStage, string>> = { quoted: 'quote_sent', accepted: 'quote_accepted' };
const DAY_MS = 86_400_000;

describe('the demo jobs’ histories', () => {
  const companies = [
    { name: DEMO_COMPANY, office: 'office@demo.example.com' },
    { name: OTHER_COMPANY, office: 'office@northgate.example.com' },
  ];

  it.each(companies)('walk $name’s jobs from enquiry to their stage one allowed move at a time, documents in their place', async (company) => {
    const org = (await Organisation.findOne({ where: { name: company.name } }))!;
    const office = await loginAs(ctx.app, { email: company.office, password: DEMO_PASSWORD });
    const now = Date.now();
    for (const job of await Job.findAll({ where: { organisationId: org.id }, order: [['reference', 'ASC']] })) {
      const res = await office.get(`/api/jobs/${job.id}/events`);
      expect(res.status).toBe(200);
      const events = res.body.events as JobEventDto[];
      let stage: JobStage | null = null;
      let movedAt = -Infinity;
      const seen = new Map<string, number>();
      for (const e of events) {
        const where = `${job.reference} (${job.stage}): ${e.kind} ${JSON.stringify(e.data)} at ${stage}`;
        const at = Date.parse(e.createdAt);
        expect(at, where).toBeLessThanOrEqual(now);
        if (stage === 'closed') expect(['site_note'], `${where}: nothing but notes after closing`).toContain(e.kind);
        if (e.kind === 'created') {
          expect(stage, where).toBeNull();
          stage = e.data.stage as JobStage;
          expect(stage, where).toBe('enquiry');
        } else {
          expect(stage, `${where}: the history starts with the job created`).not.toBeNull();
        }
        // The finish (handover.service) records `installed` and no separate stage change.
        const to = e.kind === 'stage_changed' ? (e.data.to as JobStage) : e.kind === 'installed' ? 'installed' : null;
        if (to) {
          if (e.kind === 'stage_changed') expect(e.data.from, where).toBe(stage);
          expect(STAGE_MOVES[stage!], `${where}: one allowed move`).toContain(to);
          expect(at, `${where}: later than the move before`).toBeGreaterThan(movedAt);
          if (MOVED_BY[to]) expect(seen.has(MOVED_BY[to]!), `${where}: after ${MOVED_BY[to]}`).toBe(true);
          stage = to;
          movedAt = at;
        }
        const need = NEEDS[e.kind];
        if (need?.at) expect(need.at, where).toContain(stage);
        if (need?.after) expect(seen.has(need.after), `${where}: after ${need.after}`).toBe(true);
        if (!seen.has(e.kind)) seen.set(e.kind, at);
      }
      expect(stage, `${job.reference}: the history ends at the job's stage`).toBe(job.stage);
      // Days and weeks pass between enquiry and close, not one minute.
      if (job.stage === 'closed') expect(Date.parse(events.at(-1)!.createdAt) - Date.parse(events[0].createdAt)).toBeGreaterThan(14 * DAY_MS);

      // The documents carry the dates their history shows.
      const quote = await Quote.findOne({ where: { jobId: job.id } });
      if (quote?.sentAt) expect(quote.sentAt.getTime(), job.reference).toBe(seen.get('quote_sent'));
      if (quote?.acceptedAt) expect(quote.acceptedAt.getTime(), job.reference).toBe(seen.get('quote_accepted'));
      if (quote?.declinedAt) expect(quote.declinedAt.getTime(), job.reference).toBe(seen.get('quote_declined'));
      const completion = await JobCompletion.findByPk(job.id);
      if (completion) expect(completion.completedAt.getTime(), job.reference).toBe(seen.get('installed'));
      const invoice = await Invoice.findOne({ where: { jobId: job.id, kind: 'invoice' } });
      if (invoice?.paidAt) expect(invoice.paidAt.getTime(), job.reference).toBe(seen.get('invoice_paid'));
    }
  });

  it('numbers quotes and invoices in the order they were issued, as the app does', async () => {
    for (const company of companies) {
      const org = (await Organisation.findOne({ where: { name: company.name } }))!;
      const quotes = await Quote.findAll({ where: { organisationId: org.id }, order: [['number', 'ASC']] });
      const invoices = await Invoice.findAll({ where: { organisationId: org.id, kind: 'invoice' }, order: [['seq', 'ASC']] });
      expect(quotes.map((q) => q.issueDate)).toEqual(quotes.map((q) => q.issueDate).sort());
      expect(invoices.map((i) => i.issueDate)).toEqual(invoices.map((i) => i.issueDate).sort());
      const jobs = await Job.findAll({ where: { organisationId: org.id }, order: [['reference', 'ASC']] });
      expect(jobs.map((j) => j.createdAt.getTime())).toEqual(jobs.map((j) => j.createdAt.getTime()).sort((a, b) => a - b));
    }
  });
});
