// Money races through the real SDK against the local stand-in: two tabs paying one deposit, and the
// office changing an invoice while the customer's balance checkout is open. The invariants:
// a deposit is never kept twice (a second one is refunded automatically), and an invoice is never
// marked paid for less than its total (a checkout for an old amount is expired, and if it is paid
// anyway the money goes back automatically and the office is told).
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Customer } from '../../server/db/models/customer';
import { Invoice } from '../../server/db/models/invoice';
import { Job } from '../../server/db/models/job';
import { JobEvent } from '../../server/db/models/job-event';
import { Payment } from '../../server/db/models/payment';
import { createJob, createOrgWithUsers, loginAs, type TestOrg } from '../helpers/test-app';
import { createAcceptedQuote, startPaymentsHarness, type PaymentsHarness } from './payments-fixtures';

let h: PaymentsHarness;
let org: TestOrg;
let office: Awaited<ReturnType<typeof loginAs>>;

beforeAll(async () => {
  h = await startPaymentsHarness();
  org = await createOrgWithUsers(h.ctx);
  office = await loginAs(h.ctx.app, org.office);
  await office.put('/api/payments/settings').send({ depositMode: 'percent', depositPercentBp: 2500, paymentTermsDays: 14 });
});
afterAll(async () => h?.close());

const sessionOf = (location: string) => h.fake.sessions.get(new URL(location).pathname.split('/').pop()!);
/** Pays at the stand-in; a session that was expired meanwhile refuses (that is the point). */
const tryPay = (id: string) =>
  h.fake.pay(id).then(
    () => true,
    () => false,
  );
const refundedAt = (sessionId: string) => {
  const pi = h.fake.sessions.get(sessionId)?.payment_intent;
  return h.fake.refunds.filter((r) => pi && r.payment_intent === pi).reduce((s, r) => s + r.amount, 0);
};

describe('two tabs paying one deposit', () => {
  it('keeps at most one deposit; every other completed checkout is refunded in full and the office is told', async () => {
    for (let i = 0; i < 4; i++) {
      const { job } = await createJob(org, { stage: 'accepted' });
      const { quote, link } = await createAcceptedQuote(org.id, job.id, h.ctx.config.sessionSecret);
      const starts = await Promise.all([request(h.ctx.app).post(`/pay/deposit/${link}`), request(h.ctx.app).post(`/pay/deposit/${link}`)]);
      const sessions = starts
        .filter((s) => s.status === 303 && new URL(s.headers.location, h.appUrl).origin === h.fakeUrl)
        .map((s) => sessionOf(s.headers.location)!);
      expect(sessions.length).toBeGreaterThan(0);
      await Promise.all(sessions.map((s) => tryPay(s.id)));

      const paid = await Payment.findAll({ where: { quoteId: quote.id, purpose: 'deposit', status: 'paid' } });
      expect(paid.length).toBe(1);
      for (const s of sessions.filter((x) => x.status === 'complete' && x.id !== paid[0].checkoutSessionId)) {
        expect(refundedAt(s.id)).toBe(s.amount_total);
        const row = await Payment.findOne({ where: { checkoutSessionId: s.id } });
        expect(row!.status).toBe('refunded');
        expect(await JobEvent.count({ where: { jobId: job.id, kind: 'payment_refunded' } })).toBeGreaterThan(0);
      }
      expect(refundedAt(paid[0].checkoutSessionId!)).toBe(0);
    }
  });
});

async function issuedInvoice(i: number) {
  const { job, customer } = await createJob(org, { stage: 'accepted', customerName: 'Ada Fenwick' });
  await Customer.update({ email: `race-${i}-${job.id.slice(0, 6)}@example.com` }, { where: { id: customer.id } });
  await createAcceptedQuote(org.id, job.id, h.ctx.config.sessionSecret);
  await Job.update({ stage: 'installed' }, { where: { id: job.id } });
  const res = await office.post('/api/invoices').send({ jobId: job.id, variations: [] });
  expect(res.status).toBe(201);
  const token = new URL(res.body.invoice.payUrl).pathname.split('/').pop()!;
  return { job, invoice: res.body.invoice as { id: string; grossMinor: number }, token };
}

const VARIATION = { description: 'Extra walkway board', quantity: 1, unit: 'each', unitPriceMinor: 2500, taxClass: 'standard' };

describe('the office adds a variation while the balance checkout is open', () => {
  it('expires the hosted checkout, so the old amount can no longer be paid', async () => {
    const { invoice, token } = await issuedInvoice(0);
    const go = await request(h.ctx.app).post(`/pay/invoice/${token}`);
    const session = sessionOf(go.headers.location)!;
    expect(session.amount_total).toBe(invoice.grossMinor);
    const edit = await office.patch(`/api/invoices/${invoice.id}`).send({ variations: [VARIATION] });
    expect(edit.status).toBe(200);
    expect(h.fake.sessions.get(session.id)!.status).toBe('expired');
    expect(await tryPay(session.id)).toBe(false);
    const row = (await Invoice.findByPk(invoice.id))!;
    expect(row.status).toBe('issued');
    expect(row.grossMinor).toBe(invoice.grossMinor + 3000); // 2500 + 20 % VAT
  });

  it('when the old checkout is paid at the same moment, the invoice is never paid for less than its total and an uncounted payment is refunded', async () => {
    for (let i = 1; i <= 4; i++) {
      const { job, invoice, token } = await issuedInvoice(i);
      const go = await request(h.ctx.app).post(`/pay/invoice/${token}`);
      const session = sessionOf(go.headers.location)!;
      const [edit] = await Promise.all([office.patch(`/api/invoices/${invoice.id}`).send({ variations: [VARIATION] }), tryPay(session.id)]);
      const row = (await Invoice.findByPk(invoice.id))!;
      const counted = await Payment.findAll({ where: { invoiceId: invoice.id, status: 'paid' } });
      const countedMinor = counted.reduce((s, p) => s + p.amountMinor, 0);
      if (row.status === 'paid') {
        // The payment won: it covered the whole (old, unchanged) total, and the edit was refused.
        expect(edit.status).toBe(409);
        expect(countedMinor + row.depositMinor).toBe(row.grossMinor);
      } else {
        expect(edit.status).toBe(200);
        expect(countedMinor).toBe(0);
        if (h.fake.sessions.get(session.id)!.status === 'complete') {
          expect(refundedAt(session.id)).toBe(session.amount_total);
          expect(await JobEvent.count({ where: { jobId: job.id, kind: 'payment_refunded' } })).toBe(1);
        }
      }
    }
  });

  it('refunds a completion that arrives for a checkout the app had already expired, and tells the office', async () => {
    const { job, invoice, token } = await issuedInvoice(9);
    const go = await request(h.ctx.app).post(`/pay/invoice/${token}`);
    const session = sessionOf(go.headers.location)!;
    // The service completed the session before our expiry reached it (the call failed), and the
    // row was expired by the edit: the completion must not count.
    await Payment.update({ status: 'expired' }, { where: { checkoutSessionId: session.id } });
    h.ctx.outbox.clear();
    expect(await tryPay(session.id)).toBe(true);
    expect((await Invoice.findByPk(invoice.id))!.status).toBe('issued');
    expect(refundedAt(session.id)).toBe(session.amount_total);
    expect((await Payment.findOne({ where: { checkoutSessionId: session.id } }))!.status).toBe('refunded');
    expect(await JobEvent.count({ where: { jobId: job.id, kind: 'payment_refunded' } })).toBe(1);
    const note = await h.ctx.outbox.waitFor((m) => /refunded/i.test(m.subject));
    expect(note.text).toContain('refunded');
  });
});
