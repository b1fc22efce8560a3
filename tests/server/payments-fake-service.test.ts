// The local payments stand-in, driven through the real `stripe` SDK via its host/port/protocol
// options, and its webhooks checked with the SDK's own constructEvent.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import express from 'express';
import type { AddressInfo } from 'node:net';
import { createFakePaymentService, signWebhookPayload, type FakePaymentService } from '../../server/lib/payments/fake-service';
import { createPaymentsGateway, type PaymentsGateway } from '../../server/lib/payments/gateway';

const SECRET = 'whsec_test_local_0123456789';
let fake: FakePaymentService;
let fakeHandle: { url: string; close(): Promise<void> };
let gateway: PaymentsGateway;
const received: { body: string; signature: string | undefined }[] = [];
let receiverClose: () => Promise<void>;

beforeAll(async () => {
  // A bare webhook receiver, standing in for our endpoint.
  const receiver = express();
  receiver.post('/hook', express.raw({ type: '*/*' }), (req, res) => {
    received.push({ body: (req.body as Buffer).toString('utf8'), signature: req.get('stripe-signature') });
    res.json({ received: true });
  });
  const server = receiver.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  receiverClose = () => new Promise((r) => server.close(() => r()));
  fake = createFakePaymentService({ webhookSecret: SECRET, webhookUrl: `http://127.0.0.1:${(server.address() as AddressInfo).port}/hook` });
  fakeHandle = await fake.listen(0);
  gateway = createPaymentsGateway({ secretKey: 'sk_test_local', webhookSecret: SECRET, apiUrl: fakeHandle.url });
});

afterAll(async () => {
  await fakeHandle?.close();
  await receiverClose?.();
});

const checkout = (amountMinor: number) =>
  gateway.createCheckout({
    amountMinor,
    currency: 'GBP',
    description: 'Deposit for quote Q-0042',
    reference: 'Q-0042',
    metadata: { purpose: 'deposit', quoteId: 'abc' },
    successUrl: 'http://127.0.0.1:9/pay/done?session_id={CHECKOUT_SESSION_ID}',
    cancelUrl: 'http://127.0.0.1:9/pay/cancelled',
    customerEmail: 'ada@example.com',
  });

describe('local payments stand-in through the stripe SDK', () => {
  it('creates a checkout session with the amount in minor units, the reference and metadata', async () => {
    const s = await checkout(12345);
    expect(s.id).toMatch(/^cs_test_/);
    expect(s.amountTotalMinor).toBe(12345);
    expect(s.currency).toBe('gbp');
    expect(s.clientReferenceId).toBe('Q-0042');
    expect(s.metadata).toEqual({ purpose: 'deposit', quoteId: 'abc' });
    expect(s.status).toBe('open');
    expect(s.paymentStatus).toBe('unpaid');
    expect(s.url).toBe(`${fakeHandle.url}/pay/${s.id}`);
    const again = await gateway.retrieveCheckout(s.id);
    expect(again).toEqual(s);
  });

  it('refuses a bad secret key with the service error the SDK turns into an exception', async () => {
    const bad = createPaymentsGateway({ secretKey: 'nope', webhookSecret: SECRET, apiUrl: fakeHandle.url });
    await expect(bad.retrieveCheckout('cs_test_x')).rejects.toMatchObject({ type: 'StripeAuthenticationError', statusCode: 401 });
  });

  it('reports an unknown session as a 404 resource_missing error', async () => {
    await expect(gateway.retrieveCheckout('cs_test_unknown')).rejects.toMatchObject({ statusCode: 404, code: 'resource_missing' });
  });

  it('refuses a fractional amount before it leaves our code', async () => {
    await expect(checkout(12.5)).rejects.toThrow(/positive integer of minor units/);
  });

  it('pays from the pay page: signed webhook the SDK verifies, then redirect to the success page', async () => {
    const s = await checkout(5000);
    const pageRes = await fetch(s.url!);
    const html = await pageRes.text();
    expect(html).toContain('Local test checkout');
    expect(html).toContain('£50.00');
    const before = received.length;
    const r = await fetch(`${fakeHandle.url}/pay/${s.id}/confirm`, { method: 'POST', redirect: 'manual' });
    expect(r.status).toBe(303);
    expect(r.headers.get('location')).toBe(`http://127.0.0.1:9/pay/done?session_id=${s.id}`);
    expect(received.length).toBe(before + 1);
    const { body, signature } = received[received.length - 1];
    const event = gateway.verifyWebhook(body, signature);
    expect(event.type).toBe('checkout.session.completed');
    const obj = event.data.object as { id: string; amount_total: number; payment_status: string; client_reference_id: string };
    expect(obj).toMatchObject({ id: s.id, amount_total: 5000, payment_status: 'paid', client_reference_id: 'Q-0042' });
    const after = await gateway.retrieveCheckout(s.id);
    expect(after.status).toBe('complete');
    expect(after.paymentIntentId).toMatch(/^pi_/);
    // The pay page of a completed session no longer offers to pay.
    expect((await fetch(s.url!)).status).toBe(410);
  });

  it('cancel goes back to the cancel page and leaves the session open and unpaid', async () => {
    const s = await checkout(700);
    const before = received.length;
    const r = await fetch(`${fakeHandle.url}/pay/${s.id}/cancel`, { method: 'POST', redirect: 'manual' });
    expect(r.headers.get('location')).toBe('http://127.0.0.1:9/pay/cancelled');
    expect(received.length).toBe(before);
    expect((await gateway.retrieveCheckout(s.id)).paymentStatus).toBe('unpaid');
    const expired = await gateway.expireCheckout(s.id);
    expect(expired.status).toBe('expired');
  });

  it('refunds part then the rest of a payment, and refuses more than was paid', async () => {
    const s = await checkout(10000);
    const paid = await fake.pay(s.id);
    const r1 = await gateway.refund(paid.payment_intent!, 2500);
    expect(r1).toMatchObject({ amountMinor: 2500, currency: 'gbp', status: 'succeeded' });
    await expect(gateway.refund(paid.payment_intent!, 7501)).rejects.toMatchObject({ statusCode: 400, code: 'amount_too_large' });
    const r2 = await gateway.refund(paid.payment_intent!, 7500);
    expect(r2.amountMinor).toBe(7500);
    expect(fake.refunds.filter((r) => r.payment_intent === paid.payment_intent).reduce((a, r) => a + r.amount, 0)).toBe(10000);
  });

  it('signs exactly as the SDK verifies, and the SDK rejects a tampered body or wrong secret', () => {
    const payload = JSON.stringify({ id: 'evt_1', object: 'event', type: 'checkout.session.completed', data: { object: {} } });
    const header = signWebhookPayload(payload, SECRET);
    expect(gateway.verifyWebhook(payload, header).id).toBe('evt_1');
    expect(() => gateway.verifyWebhook(payload.replace('evt_1', 'evt_2'), header)).toThrow();
    expect(() => gateway.verifyWebhook(payload, signWebhookPayload(payload, 'whsec_other'))).toThrow();
    expect(() => gateway.verifyWebhook(payload, undefined)).toThrow();
    // Older than the SDK's default five-minute tolerance.
    expect(() => gateway.verifyWebhook(payload, signWebhookPayload(payload, SECRET, Math.floor(Date.now() / 1000) - 600))).toThrow(/tolerance/);
  });
});
