// The deposit, end to end through the real `stripe` SDK against the local stand-in:
// accepted quote → our deposit page → Checkout Session → pay page → signed webhook → paid.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatDate, todayIso } from '../../shared/dates';
import { JobEvent } from '../../server/db/models/job-event';
import { Payment } from '../../server/db/models/payment';
import { PaymentEvent } from '../../server/db/models/payment-event';
import { signWebhookPayload } from '../../server/lib/payments/fake-service';
import { createJob, createOrgWithUsers, loginAs, type TestOrg } from '../helpers/test-app';
import { createAcceptedQuote, QUOTE_GROSS_MINOR, startPaymentsHarness, WEBHOOK_SECRET, type PaymentsHarness } from './payments-fixtures';

let h: PaymentsHarness;
let org: TestOrg;
let office: Awaited<ReturnType<typeof loginAs>>;

// 25 % of £575.76 = £143.94 exactly (57576 × 2500 / 10000 = 14394), worked by hand.
const DEPOSIT = 14394;

beforeAll(async () => {
  h = await startPaymentsHarness();
  org = await createOrgWithUsers(h.ctx);
  office = await loginAs(h.ctx.app, org.office);
  const res = await office.put('/api/payments/settings').send({ depositMode: 'percent', depositPercentBp: 2500, paymentTermsDays: 14 });
  expect(res.status).toBe(200);
});
afterAll(async () => h?.close());

const webhook = (body: string, signature?: string) => {
  const r = request(h.ctx.app).post('/api/payments/webhook').set('content-type', 'application/json');
  return (signature === undefined ? r : r.set('stripe-signature', signature)).send(body);
};

async function newAcceptedQuote() {
  const { job } = await createJob(org, { stage: 'accepted' });
  const { quote, link } = await createAcceptedQuote(org.id, job.id, h.ctx.config.sessionSecret);
  return { job, quote, link };
}

/** Our deposit page's button: POST → 303 to the hosted checkout. */
async function startCheckout(link: string) {
  const res = await request(h.ctx.app).post(`/pay/deposit/${link}`);
  expect(res.status).toBe(303);
  expect(res.headers['ratelimit-policy']).toBeDefined(); // each POST opens a checkout: rate-limited
  const url = new URL(res.headers.location);
  expect(url.origin).toBe(h.fakeUrl);
  const session = h.fake.sessions.get(url.pathname.split('/').pop()!)!;
  expect(session).toBeDefined();
  return session;
}

describe('deposit on acceptance', () => {
  it('stores the office deposit settings and reads them back with the company currency', async () => {
    const res = await office.get('/api/payments/settings');
    expect(res.body).toMatchObject({
      settings: { depositMode: 'percent', depositPercentBp: 2500, depositFixedMinor: null, paymentTermsDays: 14, currency: 'GBP' },
      enabled: true,
    });
    const bad = await office.put('/api/payments/settings').send({ depositMode: 'fixed', paymentTermsDays: 14 });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details[0]).toMatchObject({ path: 'depositFixedMinor', message: 'enter the deposit amount' });
    const est = await loginAs(h.ctx.app, org.estimator);
    expect((await est.put('/api/payments/settings').send({ depositMode: 'none', paymentTermsDays: 1 })).status).toBe(403);
  });

  it('accept → checkout with the amount in minor units and the quote reference → pay → signed webhook → paid, on the timeline, office e-mailed', async () => {
    const { job } = await createJob(org, { stage: 'quoted' });
    const { quote, link } = await createAcceptedQuote(org.id, job.id, h.ctx.config.sessionSecret, { status: 'sent' });
    // Before acceptance nothing is payable; the customer accepts through the quote's own public endpoint.
    expect((await request(h.ctx.app).get(`/api/payments/public/deposit/${link}`)).body.deposit).toMatchObject({ state: 'due', payUrl: null });
    const accepted = await request(h.ctx.app).post(`/api/public/quotes/${link}/accept`).send({ name: 'Ada Fenwick', acceptTerms: true });
    expect(accepted.status).toBe(200);
    expect((await request(h.ctx.app).get(`/api/payments/public/deposit/${link}`)).body.deposit).toEqual({
      state: 'due',
      amountMinor: DEPOSIT,
      currency: 'GBP',
      paidAt: null,
      payUrl: `/pay/deposit/${link}`,
    });
    expect((await office.get(`/api/payments/deposits/${quote.id}`)).body.deposit).toMatchObject({
      state: 'due',
      amountMinor: DEPOSIT,
      currency: 'GBP',
      paidAt: null,
    });
    const page = await request(h.ctx.app).get(`/pay/deposit/${link}`);
    expect(page.status).toBe(200);
    expect(page.text).toContain('£143.94');
    // The page's CSP lets its form hand over to the hosted checkout, and nowhere else.
    expect(page.headers['content-security-policy']).toContain(`form-action 'self' https://checkout.stripe.com ${h.fakeUrl}`);

    const session = await startCheckout(link);
    expect(session).toMatchObject({ amount_total: DEPOSIT, currency: 'gbp', client_reference_id: quote.number, mode: 'payment', status: 'open' });
    expect(session.metadata).toMatchObject({ quoteId: quote.id, purpose: 'deposit', organisationId: org.id });
    const payment = await Payment.findOne({ where: { checkoutSessionId: session.id } });
    expect(session.success_url).toBe(`${h.appUrl}/pay/done/${payment!.token}`);
    expect(session.cancel_url).toBe(`${h.appUrl}/pay/cancelled/${payment!.token}`);
    // Our success page never marks anything paid by itself.
    expect((await request(h.ctx.app).get(`/pay/done/${payment!.token}`)).text).toContain('waiting for the card payment service');

    h.ctx.outbox.clear();
    const paid = await fetch(`${h.fakeUrl}/pay/${session.id}/confirm`, { method: 'POST', redirect: 'manual' });
    expect(paid.status).toBe(303);
    expect(paid.headers.get('location')).toBe(session.success_url);
    expect(h.fake.deliveries.at(-1)).toMatchObject({ type: 'checkout.session.completed', status: 200 });

    const dep = (await office.get(`/api/payments/deposits/${quote.id}`)).body.deposit;
    expect(dep).toMatchObject({ state: 'paid', amountMinor: DEPOSIT, currency: 'GBP' });
    expect(Date.now() - Date.parse(dep.paidAt)).toBeLessThan(60_000);
    const events = (await office.get(`/api/jobs/${job.id}/events`)).body.events.filter((e: { kind: string }) => e.kind === 'deposit_paid');
    expect(events).toHaveLength(1);
    expect(events[0].data).toMatchObject({
      amountMinor: DEPOSIT,
      currency: 'GBP',
      quoteNumber: quote.number,
      paymentText: `Deposit of £143.94 paid for quote ${quote.number}`,
    });
    const timeline = (await office.get(`/api/payments/jobs/${job.id}/timeline`)).body.entries;
    expect(timeline).toEqual([expect.objectContaining({ kind: 'deposit-paid', amountMinor: DEPOSIT })]);
    const mail = await h.ctx.outbox.waitFor((m) => m.subject.startsWith('Deposit paid'));
    expect(mail.to).toContain(org.office.email);
    expect(mail.subject).toBe(`Deposit paid: £143.94 for quote ${quote.number}`);
    // One date style for people: "on 2 Dec 2026", not an HTTP date.
    expect(mail.text).toContain(`on ${formatDate(todayIso())}.`);
    expect(mail.text).not.toMatch(/GMT|\d{4}-\d{2}-\d{2}/);
    expect((await request(h.ctx.app).get(`/pay/done/${payment!.token}`)).text).toContain('We received your deposit of <strong>£143.94</strong>');
    // Paying again is not offered.
    expect((await request(h.ctx.app).get(`/pay/deposit/${link}`)).text).toContain('Deposit received');
    expect((await request(h.ctx.app).get(`/api/payments/public/deposit/${link}`)).body.deposit).toMatchObject({ state: 'paid', payUrl: null });
    expect(QUOTE_GROSS_MINOR * 0.25).toBe(DEPOSIT);
  });

  it('never shows the deposit amount to the installer of the job', async () => {
    const { job } = await createJob(org, { stage: 'accepted', assignedInstallerId: org.installer.id });
    const { link } = await createAcceptedQuote(org.id, job.id, h.ctx.config.sessionSecret);
    await h.fake.pay((await startCheckout(link)).id);
    const installer = await loginAs(h.ctx.app, org.installer);
    const res = await installer.get(`/api/jobs/${job.id}/events`);
    expect(res.status).toBe(200);
    const paid = res.body.events.find((e: { kind: string }) => e.kind === 'deposit_paid');
    expect(paid).toBeDefined();
    expect(JSON.stringify(res.body)).not.toMatch(/143\.94|14394/);
    expect((await installer.get(`/api/payments/jobs/${job.id}/timeline`)).status).toBe(403);
  });

  it('a replayed webhook changes nothing the second time', async () => {
    const { job, quote, link } = await newAcceptedQuote();
    const session = await startCheckout(link);
    await h.fake.pay(session.id);
    const delivery = h.fake.deliveries.at(-1)!;
    const before = await Payment.findOne({ where: { checkoutSessionId: session.id } });
    expect(before!.status).toBe('paid');
    const again = await webhook(delivery.payload, delivery.signature);
    expect(again.status).toBe(200);
    expect(again.body).toEqual({ received: true, duplicate: true });
    const after = await Payment.findOne({ where: { checkoutSessionId: session.id } });
    expect(after!.paidAt!.toISOString()).toBe(before!.paidAt!.toISOString());
    expect(await JobEvent.count({ where: { jobId: job.id, kind: 'deposit_paid' } })).toBe(1);
    // The same session reported again under a new event id is also a no-op.
    const other = JSON.stringify({ ...JSON.parse(delivery.payload), id: 'evt_test_resent_1' });
    expect((await webhook(other, signWebhookPayload(other, WEBHOOK_SECRET))).body).toEqual({ received: true, duplicate: false });
    expect(await JobEvent.count({ where: { jobId: job.id, kind: 'deposit_paid' } })).toBe(1);
    expect((await office.get(`/api/payments/deposits/${quote.id}`)).body.deposit.attempts).toBe(1);
  });

  it('the same event delivered five times at once is applied exactly once', async () => {
    const { job, link } = await newAcceptedQuote();
    const session = await startCheckout(link);
    const body = JSON.stringify({
      id: 'evt_test_burst_1',
      object: 'event',
      type: 'checkout.session.completed',
      data: { object: { ...session, status: 'complete', payment_status: 'paid', payment_intent: 'pi_burst' } },
    });
    const sig = signWebhookPayload(body, WEBHOOK_SECRET);
    const results = await Promise.all(Array.from({ length: 5 }, () => webhook(body, sig)));
    expect(results.map((r) => r.status)).toEqual([200, 200, 200, 200, 200]);
    expect(results.filter((r) => r.body.duplicate === false)).toHaveLength(1);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: 'deposit_paid' } })).toBe(1);
  });

  it('refuses unsigned, wrongly signed, stale and tampered webhooks with 400 and changes nothing', async () => {
    const { job, link } = await newAcceptedQuote();
    const session = await startCheckout(link);
    const event = {
      id: 'evt_test_forged_1',
      object: 'event',
      type: 'checkout.session.completed',
      data: { object: { ...session, status: 'complete', payment_status: 'paid', payment_intent: 'pi_forged' } },
    };
    const body = JSON.stringify(event);
    const eventsBefore = await PaymentEvent.count();
    const cases: Array<[string, string | undefined]> = [
      ['unsigned', undefined],
      ['garbage header', 'nonsense'],
      ['wrong secret', signWebhookPayload(body, 'whsec_someone_else')],
      ['stale (10 minutes old)', signWebhookPayload(body, WEBHOOK_SECRET, Math.floor(Date.now() / 1000) - 600)],
      ['signed for a different body', signWebhookPayload(body.replace('pi_forged', 'pi_other'), WEBHOOK_SECRET)],
    ];
    for (const [name, sig] of cases) {
      const res = await webhook(body, sig);
      expect(res.status, name).toBe(400);
      expect(res.body.error.code, name).toBe('bad_signature');
    }
    expect(await PaymentEvent.count()).toBe(eventsBefore);
    expect((await Payment.findOne({ where: { checkoutSessionId: session.id } }))!.status).toBe('open');
    expect(await JobEvent.count({ where: { jobId: job.id, kind: 'deposit_paid' } })).toBe(0);
    // The same body properly signed is accepted: the refusals above were about the signature only.
    expect((await webhook(body, signWebhookPayload(body, WEBHOOK_SECRET))).status).toBe(200);
    expect((await Payment.findOne({ where: { checkoutSessionId: session.id } }))!.status).toBe('paid');
  });

  it('counts no money it did not ask for, and marks an expired checkout expired (signed events the real service sends)', async () => {
    const { job, link } = await newAcceptedQuote();
    const session = await startCheckout(link);
    const send = (id: string, type: string, object: object) => {
      const body = JSON.stringify({ id, object: 'event', type, data: { object: { ...session, ...object } } });
      return webhook(body, signWebhookPayload(body, WEBHOOK_SECRET));
    };
    expect(
      (
        await send('evt_test_short_1', 'checkout.session.completed', {
          status: 'complete',
          payment_status: 'paid',
          amount_total: DEPOSIT - 1,
          payment_intent: 'pi_short',
        })
      ).status,
    ).toBe(200);
    expect((await Payment.findOne({ where: { checkoutSessionId: session.id } }))!.status).toBe('open');
    expect(await JobEvent.count({ where: { jobId: job.id, kind: 'payment_mismatch' } })).toBe(1);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: 'deposit_paid' } })).toBe(0);
    expect((await send('evt_test_expired_1', 'checkout.session.expired', { status: 'expired' })).status).toBe(200);
    expect((await Payment.findOne({ where: { checkoutSessionId: session.id } }))!.status).toBe('expired');
    // An event about a session we never opened is acknowledged and ignored.
    const stray = JSON.stringify({
      id: 'evt_test_stray_1',
      object: 'event',
      type: 'checkout.session.completed',
      data: { object: { id: 'cs_test_not_ours', payment_status: 'paid', amount_total: 1, currency: 'gbp' } },
    });
    expect((await webhook(stray, signWebhookPayload(stray, WEBHOOK_SECRET))).body).toEqual({ received: true, duplicate: false });
  });

  it('a cancelled checkout pays nothing and the customer can try again; the old checkout is expired', async () => {
    const { job, quote, link } = await newAcceptedQuote();
    const first = await startCheckout(link);
    const cancel = await fetch(`${h.fakeUrl}/pay/${first.id}/cancel`, { method: 'POST', redirect: 'manual' });
    expect(cancel.headers.get('location')).toBe(first.cancel_url);
    const cancelledPath = new URL(first.cancel_url!).pathname;
    const page = await request(h.ctx.app).get(cancelledPath);
    expect(page.text).toContain('nothing was paid');
    expect((await office.get(`/api/payments/deposits/${quote.id}`)).body.deposit).toMatchObject({ state: 'due', paidAt: null });
    expect(await JobEvent.count({ where: { jobId: job.id, kind: 'deposit_paid' } })).toBe(0);

    const retry = await request(h.ctx.app).post(cancelledPath.replace('/cancelled/', '/retry/'));
    expect(retry.status).toBe(303);
    const second = h.fake.sessions.get(new URL(retry.headers.location).pathname.split('/').pop()!)!;
    expect(second.id).not.toBe(first.id);
    expect(second.amount_total).toBe(DEPOSIT);
    expect(h.fake.sessions.get(first.id)!.status).toBe('expired');
    await h.fake.pay(second.id);
    expect((await office.get(`/api/payments/deposits/${quote.id}`)).body.deposit).toMatchObject({ state: 'paid', amountMinor: DEPOSIT, attempts: 2 });
  });

  it('takes no deposit before acceptance, or when none is asked, and hides other companies’ quotes', async () => {
    const { job } = await createJob(org, { stage: 'quoted' });
    const sent = await createAcceptedQuote(org.id, job.id, h.ctx.config.sessionSecret, { status: 'sent' });
    expect((await request(h.ctx.app).get(`/pay/deposit/${sent.link}`)).status).toBe(409);
    expect((await request(h.ctx.app).get(`/pay/deposit/${sent.link}x`)).status).toBe(404);

    const other = await createOrgWithUsers(h.ctx);
    const { job: otherJob } = await createJob(other, { stage: 'accepted' });
    const theirs = await createAcceptedQuote(other.id, otherJob.id, h.ctx.config.sessionSecret);
    expect((await office.get(`/api/payments/deposits/${theirs.quote.id}`)).status).toBe(404);
    expect((await office.get(`/api/payments/jobs/${otherJob.id}/timeline`)).status).toBe(404);
    // That company asks no deposit (no settings row): nothing is due and no checkout is opened.
    const count = h.fake.sessions.size;
    expect((await request(h.ctx.app).get(`/pay/deposit/${theirs.link}`)).text).toContain('No deposit needed');
    expect((await request(h.ctx.app).post(`/pay/deposit/${theirs.link}`)).status).toBe(303);
    expect(h.fake.sessions.size).toBe(count);
  });
});
