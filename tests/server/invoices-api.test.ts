// Invoices through the API: from an installed job's accepted quote + variations − deposit, numbered
// without gaps under concurrency, e-mailed as a PDF with a pay link, paid through the stand-in,
// frozen once paid and corrected by a credit note (refunded to the card through the SDK).
import request from 'supertest';
import { PDFParse } from 'pdf-parse';
import { simpleParser } from 'mailparser';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Customer } from '../../server/db/models/customer';
import { Invoice } from '../../server/db/models/invoice';
import { Job } from '../../server/db/models/job';
import { takeNumber } from '../../server/modules/invoices/invoices.service';
import { addDaysIso as addDays } from '../../shared/dates';
import { ensureCompanySettings } from '../../server/modules/settings/settings.service';
import { createJob, createOrgWithUsers, loginAs, type TestOrg } from '../helpers/test-app';
import { createAcceptedQuote, startPaymentsHarness, type PaymentsHarness } from './payments-fixtures';

let h: PaymentsHarness;
let org: TestOrg;
let office: Awaited<ReturnType<typeof loginAs>>;
const today = () => new Date().toISOString().slice(0, 10);

beforeAll(async () => {
  h = await startPaymentsHarness();
  org = await createOrgWithUsers(h.ctx);
  office = await loginAs(h.ctx.app, org.office);
  await office.put('/api/payments/settings').send({ depositMode: 'percent', depositPercentBp: 2500, paymentTermsDays: 14 });
});
afterAll(async () => h?.close());

/** An installed job whose accepted quote (gross £575.76) had its 25 % deposit (£143.94) paid through the stand-in. */
async function installedJobWithDeposit(opts: { pay?: boolean; email?: string } = {}) {
  const { job, customer } = await createJob(org, { stage: 'accepted', customerName: 'Ada Fenwick' });
  await Customer.update({ email: opts.email ?? `ada-${job.id.slice(0, 6)}@example.com` }, { where: { id: customer.id } });
  const { quote, link } = await createAcceptedQuote(org.id, job.id, h.ctx.config.sessionSecret);
  if (opts.pay !== false) {
    const res = await request(h.ctx.app).post(`/pay/deposit/${link}`);
    await h.fake.pay(new URL(res.headers.location).pathname.split('/').pop()!);
  }
  await Job.update({ stage: 'installed' }, { where: { id: job.id } });
  return { job, quote };
}

const VARIATION = { description: 'Two extra walkway boards found needed on site', quantity: 2, unit: 'each', unitPriceMinor: 1299, taxClass: 'standard' };

describe('invoices', () => {
  it('adds variations to the quote, takes off the deposit, and dates it by the company terms (hand-worked)', async () => {
    const { job, quote } = await installedJobWithDeposit();
    h.ctx.outbox.clear();
    const res = await office.post('/api/invoices').send({ jobId: job.id, variations: [VARIATION] });
    expect(res.status).toBe(201);
    const inv = res.body.invoice;
    // Quote: 28200 + 24700 at 0 %, 3897 + 779 VAT at 20 % = 57576. Variation: 2 × 1299 = 2598, VAT 519.6 → 520.
    // Total 57576 + 3118 = 60694; less deposit 14394 → balance 46300.
    expect(inv).toMatchObject({
      kind: 'invoice',
      status: 'issued',
      quoteReference: quote.number,
      netMinor: 28200 + 24700 + 3897 + 2598,
      taxMinor: 779 + 520,
      grossMinor: 60694,
      depositMinor: 14394,
      balanceMinor: 46300,
      overdue: false,
      currency: 'GBP',
    });
    expect(inv.number).toMatch(/^INV-\d{6}$/);
    expect(inv.issueDate).toBe(today());
    expect(inv.dueDate).toBe(addDays(today(), 14));
    expect(inv.lines.map((l: { source: string; netMinor: number; taxMinor: number; rateBp: number }) => [l.source, l.netMinor, l.taxMinor, l.rateBp])).toEqual([
      ['quote', 28200, 0, 0],
      ['quote', 24700, 0, 0],
      ['quote', 3897, 779, 2000],
      ['variation', 2598, 520, 2000],
    ]);
    expect(inv.taxByRate).toEqual([
      { rateBp: 2000, netMinor: 6495, taxMinor: 1299 },
      { rateBp: 0, netMinor: 52900, taxMinor: 0 },
    ]);

    // E-mailed to the customer with the PDF and the private pay link; the PDF agrees to the penny.
    const mail = await h.ctx.outbox.waitFor((m) => m.subject.startsWith(`Invoice ${inv.number}`));
    const parsed = await simpleParser(mail.raw);
    expect(parsed.text).toContain(inv.payUrl);
    expect(parsed.text).toContain('£463.00 to pay');
    const pdf = parsed.attachments.find((a) => a.contentType === 'application/pdf')!;
    const parser = new PDFParse({ data: new Uint8Array(pdf.content) });
    const text = (await parser.getText()).text;
    await parser.destroy();
    for (const s of [inv.number, '£606.94', '−£143.94', '£463.00', '£25.98', '£31.18', 'Two extra walkway boards', inv.payUrl]) expect(text, s).toContain(s);

    // The customer's page shows the same balance, and its button opens a checkout for exactly that.
    const token = new URL(inv.payUrl).pathname.split('/').pop()!;
    expect((await request(h.ctx.app).get(`/pay/invoice/${token}`)).text).toContain('£463.00');
    const go = await request(h.ctx.app).post(`/pay/invoice/${token}`);
    const session = h.fake.sessions.get(new URL(go.headers.location).pathname.split('/').pop()!)!;
    expect(session).toMatchObject({ amount_total: 46300, client_reference_id: inv.number });

    // Paid from the webhook; then frozen.
    h.ctx.outbox.clear();
    await h.fake.pay(session.id);
    const paid = (await office.get(`/api/invoices/${inv.id}`)).body.invoice;
    expect(paid).toMatchObject({ status: 'paid', balanceMinor: 0 });
    await h.ctx.outbox.waitFor((m) => m.subject === `Invoice ${inv.number} paid: £463.00`);
    const events = (await office.get(`/api/jobs/${job.id}/events`)).body.events.map((e: { kind: string }) => e.kind);
    expect(events).toEqual(expect.arrayContaining(['deposit_paid', 'invoice_issued', 'invoice_paid']));
    const edit = await office.patch(`/api/invoices/${inv.id}`).send({ notes: 'changed' });
    expect(edit.status).toBe(409);
    expect(edit.body.error.code).toBe('invoice_paid');
    expect((await request(h.ctx.app).get(`/pay/invoice/${token}`)).text).toContain('This invoice is paid');

    // The correction is a credit note, refunded to the card through the SDK.
    const cn = await office.post(`/api/invoices/${inv.id}/credit-notes`).send({
      reason: 'One board was not fitted',
      lines: [{ description: 'Walkway board not fitted', quantity: 1, unitPriceMinor: 1299, taxClass: 'standard' }],
      refund: true,
    });
    expect(cn.status).toBe(201);
    // 1299 + 20 % (259.8 → 260) = 1559.
    expect(cn.body.creditNote).toMatchObject({ kind: 'credit_note', grossMinor: 1559, creditedInvoiceNumber: inv.number });
    expect(cn.body.creditNote.number).toMatch(/^CN-\d{6}$/);
    const refund = h.fake.refunds.at(-1)!;
    expect(refund).toMatchObject({ amount: 1559, payment_intent: h.fake.sessions.get(session.id)!.payment_intent });
    expect((await office.get(`/api/invoices/${inv.id}`)).body.invoice).toMatchObject({
      creditedMinor: 1559,
      status: 'paid',
      creditNotes: [expect.objectContaining({ number: cn.body.creditNote.number })],
    });
    // More than what is left to credit is refused.
    const tooMuch = await office
      .post(`/api/invoices/${inv.id}/credit-notes`)
      .send({ reason: 'x', lines: [{ description: 'all', quantity: 1, unitPriceMinor: 60000, taxClass: 'standard' }] });
    expect(tooMuch.status).toBe(422);
  });

  it('refuses a job that is not installed, a second invoice for a job, and another company’s job', async () => {
    const { job } = await installedJobWithDeposit({ pay: false });
    await Job.update({ stage: 'scheduled' }, { where: { id: job.id } });
    const early = await office.post('/api/invoices').send({ jobId: job.id, send: false });
    expect([early.status, early.body.error.code]).toEqual([409, 'job_not_installed']);
    await Job.update({ stage: 'installed' }, { where: { id: job.id } });
    const first = await office.post('/api/invoices').send({ jobId: job.id, send: false });
    expect(first.status).toBe(201);
    expect(first.body.invoice).toMatchObject({ depositMinor: 0, balanceMinor: 57576 }); // no deposit was paid
    const twice = await office.post('/api/invoices').send({ jobId: job.id, send: false });
    expect([twice.status, twice.body.error.code]).toEqual([409, 'invoice_exists']);
    const other = await createOrgWithUsers(h.ctx);
    const theirs = await createJob(other, { stage: 'installed' });
    expect((await office.post('/api/invoices').send({ jobId: theirs.job.id })).status).toBe(404);
    expect((await office.get(`/api/invoices/${first.body.invoice.id}`)).status).toBe(200);
    const otherOffice = await loginAs(h.ctx.app, other.office);
    expect((await otherOffice.get(`/api/invoices/${first.body.invoice.id}`)).status).toBe(404);
    const est = await loginAs(h.ctx.app, org.estimator);
    expect((await est.get('/api/invoices')).status).toBe(403);
  });

  it('lets the office change an unpaid invoice, and shows it overdue after its due date', async () => {
    const { job } = await installedJobWithDeposit();
    const inv = (await office.post('/api/invoices').send({ jobId: job.id, send: false })).body.invoice;
    const changed = await office.patch(`/api/invoices/${inv.id}`).send({ variations: [VARIATION] });
    expect(changed.status).toBe(200);
    expect(changed.body.invoice).toMatchObject({ grossMinor: 60694, balanceMinor: 46300 });
    // A credit note on an unpaid invoice lowers what is left to pay (nothing to refund), and then the
    // invoice itself is frozen too.
    const refundRefused = await office
      .post(`/api/invoices/${inv.id}/credit-notes`)
      .send({ reason: 'goodwill', lines: [{ description: 'Goodwill', quantity: 1, unitPriceMinor: 1000, taxClass: 'standard' }], refund: true });
    expect([refundRefused.status, refundRefused.body.error.details[0].path]).toEqual([422, 'refund']);
    const cn = await office
      .post(`/api/invoices/${inv.id}/credit-notes`)
      .send({ reason: 'goodwill', lines: [{ description: 'Goodwill', quantity: 1, unitPriceMinor: 1000, taxClass: 'standard' }] });
    expect(cn.body.creditNote.grossMinor).toBe(1200); // £10.00 + 20 % VAT
    expect((await office.get(`/api/invoices/${inv.id}`)).body.invoice).toMatchObject({ creditedMinor: 1200, balanceMinor: 46300 - 1200, status: 'issued' });
    expect((await office.patch(`/api/invoices/${inv.id}`).send({ notes: 'x' })).body.error.code).toBe('invoice_credited');
    await Invoice.update({ issueDate: '2026-01-01', dueDate: '2026-01-15' }, { where: { id: inv.id } });
    const overdue = (await office.get('/api/invoices?status=overdue')).body.invoices;
    expect(overdue.map((i: { id: string }) => i.id)).toContain(inv.id);
    expect(overdue.every((i: { overdue: boolean }) => i.overdue)).toBe(true);
    expect((await office.get(`/api/invoices/${inv.id}`)).body.invoice.overdue).toBe(true);
  });

  it('numbers concurrent invoices without gaps or duplicates', async () => {
    const fresh = await createOrgWithUsers(h.ctx);
    const freshOffice = await loginAs(h.ctx.app, fresh.office);
    const jobs = [];
    for (let i = 0; i < 12; i++) {
      const { job } = await createJob(fresh, { stage: 'installed' });
      await createAcceptedQuote(fresh.id, job.id, h.ctx.config.sessionSecret);
      jobs.push(job);
    }
    // The company's settings row and default tax rates are created on first use; create them before
    // the burst (their first creation is not what this test is about, and is not safe to race).
    await ensureCompanySettings(fresh.id);
    // Two of the twelve are asked twice at once: one of each pair must fail and give no number away.
    const results = await Promise.all([...jobs, jobs[3], jobs[7]].map((j) => freshOffice.post('/api/invoices').send({ jobId: j.id, send: false })));
    expect(results.map((r) => r.status).sort()).toEqual([...Array(12).fill(201), 409, 409]);
    const created = results.filter((r) => r.status === 201).map((r) => r.body.invoice.number as string);
    expect(results.filter((r) => r.status === 409)).toHaveLength(2);
    expect(created.sort()).toEqual(Array.from({ length: 12 }, (_, i) => `INV-${String(i + 1).padStart(6, '0')}`));
    // A rolled-back transaction gives its number back.
    await h.ctx.deps.sequelize
      .transaction(async (t) => {
        expect(await takeNumber(h.ctx.deps, fresh.id, 'INV', t)).toBe(13);
        throw new Error('rolled back');
      })
      .catch(() => undefined);
    await h.ctx.deps.sequelize.transaction(async (t) => expect(await takeNumber(h.ctx.deps, fresh.id, 'INV', t)).toBe(13));
  });
});
