/**
 * A local stand-in for the hosted payments service, for development and tests.
 *
 * It answers the calls Quiltline makes through the `stripe` SDK, with the same request encoding
 * (form-encoded, bracketed keys) and the same response shapes for the fields we read:
 *   POST /v1/checkout/sessions           create a Checkout Session (mode=payment, price_data lines)
 *   GET  /v1/checkout/sessions/:id       retrieve it
 *   POST /v1/checkout/sessions/:id/expire expire an open session
 *   POST /v1/refunds                     refund (part of) a paid session's payment intent
 * and serves a plain "pay" page standing in for the hosted checkout. Paying there marks the session
 * paid, POSTs a signed `checkout.session.completed` event to the webhook URL (header
 * `Stripe-Signature: t=<unix>,v1=<hex HMAC-SHA256(secret, "<t>.<payload>")>`, the documented scheme),
 * then redirects to the session's success_url. Cancelling redirects to cancel_url and changes nothing.
 *
 * The product points the SDK here through its documented host/port/protocol options; nothing in
 * the product knows it is talking to a fake. State is in memory and lost on restart.
 */
import express, { type Request, type Response } from 'express';
import { createHmac, randomBytes } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { formatMoney } from '../../../shared/quote/money';
import { escapeHtml, page } from './fake-checkout-page';

export interface FakeSession {
  id: string;
  object: 'checkout.session';
  amount_subtotal: number;
  amount_total: number;
  cancel_url: string | null;
  client_reference_id: string | null;
  created: number;
  currency: string;
  customer_email: string | null;
  expires_at: number;
  livemode: false;
  metadata: Record<string, string>;
  mode: 'payment';
  payment_intent: string | null;
  payment_status: 'unpaid' | 'paid';
  status: 'open' | 'complete' | 'expired';
  success_url: string;
  url: string | null;
  /** not part of the service's shape: kept for the pay page */
  _lines: { name: string; unitAmount: number; quantity: number }[];
}

export interface FakeRefund {
  id: string;
  object: 'refund';
  amount: number;
  charge: string | null;
  created: number;
  currency: string;
  metadata: Record<string, string>;
  payment_intent: string;
  reason: string | null;
  status: 'succeeded';
}

export interface FakeDelivery {
  eventId: string;
  type: string;
  payload: string;
  signature: string;
  status: number | null;
  error?: string;
}

export interface FakePaymentServiceOptions {
  /** the webhook signing secret shared with the product (whsec_…) */
  webhookSecret: string;
  /** where events are POSTed; may be set later with setWebhookUrl */
  webhookUrl?: string;
}

export interface FakePaymentService {
  app: express.Express;
  sessions: Map<string, FakeSession>;
  refunds: FakeRefund[];
  deliveries: FakeDelivery[];
  setWebhookUrl(url: string): void;
  /** start on 127.0.0.1; port 0 picks a free one */
  listen(port?: number): Promise<{ url: string; port: number; close(): Promise<void> }>;
  /** pay a session as the pay page's button does (for scripted use) */
  pay(sessionId: string): Promise<FakeSession>;
}

const now = () => Math.floor(Date.now() / 1000);
const newId = (prefix: string) => `${prefix}_${randomBytes(12).toString('hex')}`;

/** Sign a payload the way the hosted service documents: v1 = HMAC-SHA256(secret, `${t}.${payload}`). */
export function signWebhookPayload(payload: string, secret: string, timestamp = now()): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${v1}`;
}

class ApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly param?: string,
    readonly code?: string,
  ) {
    super(message);
  }
}

function sendError(res: Response, err: ApiError) {
  res.status(err.status).json({
    error: { type: err.status === 401 ? 'authentication_error' : 'invalid_request_error', message: err.message, param: err.param, code: err.code },
  });
}

function toInt(v: unknown, param: string): number {
  const s = typeof v === 'string' ? v : typeof v === 'number' ? String(v) : '';
  if (!/^\d+$/.test(s)) throw new ApiError(400, `Invalid integer: ${String(v)}`, param);
  return Number(s);
}

function stringRecord(v: unknown): Record<string, string> {
  if (!v || typeof v !== 'object') return {};
  return Object.fromEntries(Object.entries(v as Record<string, unknown>).map(([k, x]) => [k, String(x)]));
}

/** The public view of a session: what the SDK receives. */
function sessionBody(s: FakeSession) {
  const { _lines, ...rest } = s;
  void _lines;
  return rest;
}

export function createFakePaymentService(options: FakePaymentServiceOptions): FakePaymentService {
  let webhookUrl = options.webhookUrl ?? '';
  let baseUrl = '';
  const sessions = new Map<string, FakeSession>();
  const refunds: FakeRefund[] = [];
  const deliveries: FakeDelivery[] = [];
  const app = express();
  app.disable('x-powered-by');

  const api = express.Router();
  api.use(express.urlencoded({ extended: true, limit: '100kb' }));
  api.use((req, res, next) => {
    const auth = req.get('authorization') ?? '';
    if (!/^Bearer sk_(test|live)_\S+$/.test(auth)) {
      return sendError(res, new ApiError(401, 'Invalid API Key provided.'));
    }
    next();
  });
  // Like the service: a POST repeated with the same Idempotency-Key returns the first response.
  const idempotent = new Map<string, unknown>();
  api.use((req, res, next) => {
    const key = req.method === 'POST' ? req.get('idempotency-key') : undefined;
    if (!key) return next();
    if (idempotent.has(key)) return res.json(idempotent.get(key));
    const json = res.json.bind(res);
    res.json = (body: unknown) => {
      if (res.statusCode < 400) idempotent.set(key, body);
      return json(body);
    };
    next();
  });

  api.post('/checkout/sessions', (req, res) => {
    const b = (req.body ?? {}) as Record<string, unknown>;
    if (b.mode !== 'payment') throw new ApiError(400, 'Only mode=payment is supported by the local stand-in.', 'mode');
    if (typeof b.success_url !== 'string' || !/^https?:\/\//.test(b.success_url)) {
      throw new ApiError(400, 'Missing required param: success_url.', 'success_url');
    }
    const rawLines = Array.isArray(b.line_items) ? b.line_items : b.line_items && typeof b.line_items === 'object' ? Object.values(b.line_items) : [];
    if (rawLines.length === 0) throw new ApiError(400, 'Missing required param: line_items.', 'line_items');
    let currency = '';
    const lines = rawLines.map((raw, i) => {
      const l = raw as { price_data?: { currency?: string; unit_amount?: string; product_data?: { name?: string } }; quantity?: string };
      const pd = l.price_data;
      if (!pd) throw new ApiError(400, 'Only price_data lines are supported by the local stand-in.', `line_items[${i}][price_data]`);
      const cur = String(pd.currency ?? '').toLowerCase();
      if (!/^[a-z]{3}$/.test(cur)) throw new ApiError(400, 'Invalid currency.', `line_items[${i}][price_data][currency]`);
      if (currency && cur !== currency) throw new ApiError(400, 'All line items must share one currency.', `line_items[${i}][price_data][currency]`);
      currency = cur;
      const name = pd.product_data?.name;
      if (!name) throw new ApiError(400, 'Missing required param: product_data[name].', `line_items[${i}][price_data][product_data][name]`);
      const unitAmount = toInt(pd.unit_amount, `line_items[${i}][price_data][unit_amount]`);
      const quantity = toInt(l.quantity ?? '1', `line_items[${i}][quantity]`);
      if (quantity < 1) throw new ApiError(400, 'Quantity must be at least 1.', `line_items[${i}][quantity]`);
      return { name: String(name), unitAmount, quantity };
    });
    const amount = lines.reduce((sum, l) => sum + l.unitAmount * l.quantity, 0);
    if (amount < 1) throw new ApiError(400, 'The Checkout Session total must be greater than zero.', 'line_items', 'amount_too_small');
    const id = newId('cs_test');
    const created = now();
    const session: FakeSession = {
      id,
      object: 'checkout.session',
      amount_subtotal: amount,
      amount_total: amount,
      cancel_url: typeof b.cancel_url === 'string' ? b.cancel_url : null,
      client_reference_id: typeof b.client_reference_id === 'string' ? b.client_reference_id : null,
      created,
      currency,
      customer_email: typeof b.customer_email === 'string' ? b.customer_email : null,
      expires_at: b.expires_at ? toInt(b.expires_at, 'expires_at') : created + 24 * 3600,
      livemode: false,
      metadata: stringRecord(b.metadata),
      mode: 'payment',
      payment_intent: null,
      payment_status: 'unpaid',
      status: 'open',
      success_url: b.success_url,
      url: `${baseUrl}/pay/${id}`,
      _lines: lines,
    };
    sessions.set(id, session);
    res.json(sessionBody(session));
  });

  api.get('/checkout/sessions/:id', (req, res) => {
    const s = sessions.get(String(req.params.id));
    if (!s) throw new ApiError(404, `No such checkout.session: '${String(req.params.id)}'`, 'session', 'resource_missing');
    res.json(sessionBody(s));
  });

  api.post('/checkout/sessions/:id/expire', (req, res) => {
    const s = sessions.get(String(req.params.id));
    if (!s) throw new ApiError(404, `No such checkout.session: '${String(req.params.id)}'`, 'session', 'resource_missing');
    if (s.status !== 'open') throw new ApiError(400, `Only Checkout Sessions with a status of open can be expired.`, undefined, 'checkout_session_not_open');
    s.status = 'expired';
    s.url = null;
    res.json(sessionBody(s));
  });

  api.post('/refunds', (req, res) => {
    const b = (req.body ?? {}) as Record<string, unknown>;
    const pi = typeof b.payment_intent === 'string' ? b.payment_intent : '';
    const session = [...sessions.values()].find((s) => s.payment_intent && s.payment_intent === pi);
    if (!session) throw new ApiError(400, `No such payment_intent: '${pi}'`, 'payment_intent', 'resource_missing');
    const refunded = refunds.filter((r) => r.payment_intent === pi).reduce((sum, r) => sum + r.amount, 0);
    const remaining = session.amount_total - refunded;
    const amount = b.amount === undefined ? remaining : toInt(b.amount, 'amount');
    if (remaining <= 0) throw new ApiError(400, 'This payment has already been fully refunded.', undefined, 'charge_already_refunded');
    if (amount < 1 || amount > remaining) {
      throw new ApiError(400, `Refund amount (${amount}) is greater than the unrefunded amount (${remaining}).`, 'amount', 'amount_too_large');
    }
    const refund: FakeRefund = {
      id: newId('re'),
      object: 'refund',
      amount,
      charge: null,
      created: now(),
      currency: session.currency,
      metadata: stringRecord(b.metadata),
      payment_intent: pi,
      reason: typeof b.reason === 'string' ? b.reason : null,
      status: 'succeeded',
    };
    refunds.push(refund);
    res.json(refund);
  });

  api.use((req, res) =>
    sendError(res, new ApiError(404, `Unrecognized request URL (${req.method}: ${req.originalUrl}). The local stand-in does not cover it.`)),
  );
  api.use((err: unknown, _req: Request, res: Response, _next: express.NextFunction) => {
    void _next;
    if (err instanceof ApiError) return sendError(res, err);
    sendError(res, new ApiError(500, err instanceof Error ? err.message : 'error'));
  });
  app.use('/v1', api);

  async function deliver(type: string, object: unknown): Promise<FakeDelivery> {
    const event = {
      id: newId('evt'),
      object: 'event',
      api_version: null,
      created: now(),
      data: { object },
      livemode: false,
      pending_webhooks: 1,
      request: { id: null, idempotency_key: null },
      type,
    };
    const payload = JSON.stringify(event, null, 2);
    const signature = signWebhookPayload(payload, options.webhookSecret);
    const d: FakeDelivery = { eventId: event.id, type, payload, signature, status: null };
    deliveries.push(d);
    if (!webhookUrl) {
      d.error = 'no webhook URL configured';
      return d;
    }
    try {
      const r = await fetch(webhookUrl, {
        method: 'POST',
        headers: { 'content-type': 'application/json; charset=utf-8', 'stripe-signature': signature, 'user-agent': 'Quiltline-local-payments/1' },
        body: payload,
      });
      d.status = r.status;
    } catch (e) {
      d.error = e instanceof Error ? e.message : String(e);
    }
    return d;
  }

  async function pay(id: string): Promise<FakeSession> {
    const s = sessions.get(id);
    if (!s) throw new ApiError(404, 'No such checkout session');
    if (s.status !== 'open') throw new ApiError(400, `This checkout session is ${s.status}.`);
    s.status = 'complete';
    s.payment_status = 'paid';
    s.payment_intent = newId('pi');
    s.url = null;
    await deliver('checkout.session.completed', sessionBody(s));
    return s;
  }

  app.get('/pay/:id', (req, res) => {
    const s = sessions.get(String(req.params.id));
    res.set('content-type', 'text/html; charset=utf-8');
    if (!s) return res.status(404).send(page('Checkout not found', '<p>This checkout link is not known to the local stand-in.</p>'));
    if (s.status !== 'open') {
      return res.status(410).send(page('Checkout closed', `<p>This checkout is <strong>${escapeHtml(s.status)}</strong>.</p>`));
    }
    const rows = s._lines
      .map(
        (l) =>
          `<tr><td>${escapeHtml(l.name)}${l.quantity > 1 ? ` × ${l.quantity}` : ''}</td><td class="num">${formatMoney(l.unitAmount * l.quantity, s.currency.toUpperCase())}</td></tr>`,
      )
      .join('');
    const total = formatMoney(s.amount_total, s.currency.toUpperCase());
    res.send(
      page(
        'Pay',
        `<table>${rows}<tr class="total"><td>Total</td><td class="num" data-testid="total">${total}</td></tr></table>
        ${s.client_reference_id ? `<p class="ref">Reference <code>${escapeHtml(s.client_reference_id)}</code></p>` : ''}
        <form method="post" action="/pay/${s.id}/confirm"><button type="submit" class="pay">Pay ${total}</button></form>
        <form method="post" action="/pay/${s.id}/cancel"><button type="submit" class="cancel">Cancel and go back</button></form>`,
      ),
    );
  });

  app.post('/pay/:id/confirm', async (req, res) => {
    const id = String(req.params.id);
    const s = sessions.get(id);
    if (!s || s.status !== 'open') return res.redirect(303, `/pay/${id}`);
    await pay(id);
    res.redirect(303, s.success_url.replace('{CHECKOUT_SESSION_ID}', s.id));
  });

  app.post('/pay/:id/cancel', (req, res) => {
    const s = sessions.get(String(req.params.id));
    if (!s) return res.redirect(303, `/pay/${String(req.params.id)}`);
    res.redirect(303, (s.cancel_url ?? s.success_url).replace('{CHECKOUT_SESSION_ID}', s.id));
  });

  return {
    app,
    sessions,
    refunds,
    deliveries,
    setWebhookUrl(url) {
      webhookUrl = url;
    },
    pay,
    listen(port = 0) {
      return new Promise((resolve, reject) => {
        const server: Server = app.listen(port, '127.0.0.1');
        server.once('error', reject);
        server.once('listening', () => {
          const actual = (server.address() as AddressInfo).port;
          baseUrl = `http://127.0.0.1:${actual}`;
          resolve({
            url: baseUrl,
            port: actual,
            close: () =>
              new Promise<void>((r) => {
                server.closeAllConnections();
                server.close(() => r());
              }),
          });
        });
      });
    },
  };
}
