// Shared set-up for the payments and invoices tests: the local payments stand-in on an ephemeral
// port, the real app listening on another (the stand-in POSTs webhooks to it), and accepted quotes.
import { randomBytes } from 'node:crypto';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import { Quote } from '../../server/db/models/quote';
import { QuoteLine } from '../../server/db/models/quote-line';
import { createFakePaymentService, type FakePaymentService } from '../../server/lib/payments/fake-service';
import { signQuoteLink } from '../../server/modules/quotes/quote-link';
import { UK_DEFAULT_TAX_RATES } from '../../shared/quote/tax';
import { createTestContext, type TestContext } from '../helpers/test-app';

export const WEBHOOK_SECRET = 'whsec_test_quiltline_0123456789abcdef';

export interface PaymentsHarness {
  ctx: TestContext;
  fake: FakePaymentService;
  fakeUrl: string;
  appUrl: string;
  close(): Promise<void>;
}

async function freePort(): Promise<number> {
  const { createServer } = await import('node:net');
  return new Promise((resolve) => {
    const s = createServer().listen(0, '127.0.0.1', () => {
      const port = (s.address() as AddressInfo).port;
      s.close(() => resolve(port));
    });
  });
}

/**
 * The stand-in plus the app, wired only through configuration: the SDK gets the stand-in's URL via
 * PAYMENTS_API_URL (host/port/protocol), the stand-in gets our webhook URL.
 */
export async function startPaymentsHarness(): Promise<PaymentsHarness> {
  const fake = createFakePaymentService({ webhookSecret: WEBHOOK_SECRET });
  const fakeHandle = await fake.listen(0);
  const port = await freePort();
  const appUrl = `http://127.0.0.1:${port}`;
  const ctx = await createTestContext({
    APP_URL: appUrl,
    STRIPE_SECRET_KEY: 'sk_test_quiltline_tests',
    STRIPE_WEBHOOK_SECRET: WEBHOOK_SECRET,
    PAYMENTS_API_URL: fakeHandle.url,
  });
  const server: Server = ctx.app.listen(port, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  fake.setWebhookUrl(`${appUrl}/api/payments/webhook`);
  return {
    ctx,
    fake,
    fakeUrl: fakeHandle.url,
    appUrl,
    async close() {
      server.closeAllConnections();
      await new Promise((r) => server.close(r));
      await fakeHandle.close();
      await ctx.close();
    },
  };
}

/**
 * An accepted quote on a job, priced with the UK default rates on 1 December 2026 (HMRC VAT Notice
 * 708/6: installed energy-saving materials zero-rated until 31 March 2027, other items 20 %).
 * Hand-worked: 12 × £23.50 = £282.00 at 0 %; 6.5 h × £38.00 = £247.00 at 0 %;
 * 3 × £12.99 = £38.97 + VAT £7.79 (779.4p → 779p). Gross £575.76 (57576p).
 */
export const QUOTE_GROSS_MINOR = 57576;

/** The pricing date the hand-worked total above depends on (the dated tax rates); kept fixed on purpose. */
const PRICED_ON = '2026-12-01';

/** A date `days` after today (UTC), so the quote is still valid whenever the tests run. */
function isoDaysFromToday(days: number): string {
  return new Date(Date.now() + days * 86_400_000).toISOString().slice(0, 10);
}

export async function createAcceptedQuote(organisationId: string, jobId: string, secret: string, opts: { status?: 'accepted' | 'sent'; number?: string } = {}) {
  const nonce = randomBytes(16).toString('base64url');
  const quote = await Quote.create({
    organisationId,
    jobId,
    number: opts.number ?? `Q-T${randomBytes(3).toString('hex')}`,
    version: 1,
    status: opts.status ?? 'accepted',
    currency: 'GBP',
    locale: 'en-GB',
    issueDate: PRICED_ON,
    validUntil: isoDaysFromToday(30),
    notes: '',
    snapshot: { taxRates: UK_DEFAULT_TAX_RATES },
    linkNonce: nonce,
    sentAt: new Date(),
    acceptedAt: opts.status === 'sent' ? null : new Date(),
    acceptedName: opts.status === 'sent' ? null : 'Ada Fenwick',
    declinedAt: null,
    declineReason: null,
    createdById: null,
  } as never);
  const lines = [
    { kind: 'material', description: 'Mineral-wool roll 200 mm', quantity: 12, unit: 'roll', unitPriceMinor: 2350, taxClass: 'energy_saving' },
    { kind: 'labour', description: 'Labour, two layers', quantity: 6.5, unit: 'h', unitPriceMinor: 3800, taxClass: 'energy_saving' },
    { kind: 'extra', description: 'Walkway board', quantity: 3, unit: 'each', unitPriceMinor: 1299, taxClass: 'standard' },
  ];
  await QuoteLine.bulkCreate(
    lines.map((l, i) => ({
      ...l,
      organisationId,
      quoteId: quote.id,
      position: i + 1,
      unitCostMinor: 0,
      productId: null,
      extraKind: null,
      altQuantity: null,
      note: '',
    })) as never,
  );
  const link = signQuoteLink({ quoteId: quote.id, nonce, exp: Math.floor(Date.now() / 1000) + 30 * 86400 }, secret);
  return { quote, link };
}
