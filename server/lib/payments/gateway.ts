/**
 * The payments adapter: the one place that talks to the hosted payments service, through the
 * `stripe` SDK. Services receive a PaymentsGateway; they never import the SDK.
 *
 * Where requests go is configuration only: with no `apiUrl` the SDK uses its default host; with
 * `apiUrl` (e.g. the local stand-in, http://127.0.0.1:12111) it is split into the SDK's documented
 * `host`, `port` and `protocol` options.
 */
import Stripe from 'stripe';

export interface PaymentsConfig {
  secretKey: string;
  webhookSecret: string;
  /** base URL of the API; unset = the service's own */
  apiUrl?: string;
}

export interface CheckoutRequest {
  amountMinor: number;
  /** ISO 4217, lower or upper case */
  currency: string;
  /** shown to the payer, e.g. "Deposit for quote Q-0007" */
  description: string;
  /** our reference (quote or invoice number), sent as client_reference_id */
  reference: string;
  metadata: Record<string, string>;
  successUrl: string;
  cancelUrl: string;
  customerEmail?: string | null;
  /** idempotency key so a retried request never creates two sessions */
  idempotencyKey?: string;
}

export interface CheckoutSummary {
  id: string;
  url: string | null;
  status: string | null;
  paymentStatus: string;
  amountTotalMinor: number | null;
  currency: string | null;
  paymentIntentId: string | null;
  clientReferenceId: string | null;
  metadata: Record<string, string>;
}

export interface RefundSummary {
  id: string;
  amountMinor: number;
  currency: string;
  status: string | null;
}

export interface PaymentsGateway {
  createCheckout(req: CheckoutRequest): Promise<CheckoutSummary>;
  retrieveCheckout(id: string): Promise<CheckoutSummary>;
  expireCheckout(id: string): Promise<CheckoutSummary>;
  refund(paymentIntentId: string, amountMinor: number, metadata?: Record<string, string>): Promise<RefundSummary>;
  /** Verify the signature and parse; throws on an unsigned, wrongly signed or stale body. */
  verifyWebhook(rawBody: Buffer | string, signatureHeader: string | undefined): Stripe.Event;
}

/**
 * How far a webhook's signed timestamp may be from our clock, either way: the SDK's default of five
 * minutes (the service's documentation on verifying webhook signatures recommends it).
 */
export const WEBHOOK_TOLERANCE_SECONDS = 300;

function sdkOptions(apiUrl?: string): ConstructorParameters<typeof Stripe>[1] {
  const base: ConstructorParameters<typeof Stripe>[1] = { telemetry: false, maxNetworkRetries: 2, timeout: 20_000, appInfo: { name: 'Quiltline' } };
  if (!apiUrl) return base;
  const u = new URL(apiUrl);
  const protocol = u.protocol.replace(':', '');
  if (protocol !== 'http' && protocol !== 'https') throw new Error(`PAYMENTS_API_URL must be http(s), got ${apiUrl}`);
  return { ...base, host: u.hostname, port: Number(u.port || (protocol === 'https' ? 443 : 80)), protocol };
}

function summarise(s: Stripe.Checkout.Session): CheckoutSummary {
  return {
    id: s.id,
    url: s.url,
    status: s.status,
    paymentStatus: s.payment_status,
    amountTotalMinor: s.amount_total,
    currency: s.currency,
    paymentIntentId: typeof s.payment_intent === 'string' ? s.payment_intent : (s.payment_intent?.id ?? null),
    clientReferenceId: s.client_reference_id,
    metadata: (s.metadata ?? {}) as Record<string, string>,
  };
}

/** Build the gateway over the SDK. */
export function createPaymentsGateway(config: PaymentsConfig): PaymentsGateway {
  if (!config.secretKey) throw new Error('payments: a secret key is required');
  if (!config.webhookSecret) throw new Error('payments: a webhook signing secret is required');
  const stripe = new Stripe(config.secretKey, sdkOptions(config.apiUrl));
  return {
    async createCheckout(req) {
      if (!Number.isInteger(req.amountMinor) || req.amountMinor < 1)
        throw new Error(`payments: amount must be a positive integer of minor units, got ${req.amountMinor}`);
      const session = await stripe.checkout.sessions.create(
        {
          mode: 'payment',
          line_items: [
            { quantity: 1, price_data: { currency: req.currency.toLowerCase(), unit_amount: req.amountMinor, product_data: { name: req.description } } },
          ],
          client_reference_id: req.reference,
          metadata: req.metadata,
          success_url: req.successUrl,
          cancel_url: req.cancelUrl,
          ...(req.customerEmail ? { customer_email: req.customerEmail } : {}),
        },
        req.idempotencyKey ? { idempotencyKey: req.idempotencyKey } : undefined,
      );
      return summarise(session);
    },
    async retrieveCheckout(id) {
      return summarise(await stripe.checkout.sessions.retrieve(id));
    },
    async expireCheckout(id) {
      return summarise(await stripe.checkout.sessions.expire(id));
    },
    async refund(paymentIntentId, amountMinor, metadata) {
      const r = await stripe.refunds.create({ payment_intent: paymentIntentId, amount: amountMinor, ...(metadata ? { metadata } : {}) });
      return { id: r.id, amountMinor: r.amount, currency: r.currency, status: r.status };
    },
    verifyWebhook(rawBody, signatureHeader) {
      const event = stripe.webhooks.constructEvent(rawBody, signatureHeader ?? '', config.webhookSecret, WEBHOOK_TOLERANCE_SECONDS);
      // The SDK refuses only events older than the tolerance; one dated ahead of our clock by more
      // than the same tolerance is refused too (the signed timestamp is authentic once verified).
      const t = Number(/(?:^|,)\s*t=(\d+)/.exec(signatureHeader ?? '')?.[1]);
      if (!Number.isFinite(t) || t - Math.floor(Date.now() / 1000) > WEBHOOK_TOLERANCE_SECONDS) {
        throw new Error('Timestamp outside the tolerance zone (dated in the future)');
      }
      return event;
    },
  };
}
