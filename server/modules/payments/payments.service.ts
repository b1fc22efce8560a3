import { randomBytes } from 'node:crypto';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import type { DepositStatus, PaymentSettings, PaymentSettingsBody, PaymentTimelineEntry } from '../../../shared/api/payments';
import { formatDate } from '../../../shared/dates';
import { formatMoney } from '../../../shared/quote/money';
import type { AppDeps } from '../../deps';
import { Invoice } from '../../db/models/invoice';
import { Job } from '../../db/models/job';
import { JobEvent } from '../../db/models/job-event';
import { Payment } from '../../db/models/payment';
import { PaymentSetting } from '../../db/models/payment-setting';
import { Quote } from '../../db/models/quote';
import { BadRequestError, ConflictError, NotFoundError } from '../../lib/errors';
import { loadCompanySettings } from '../settings/settings.service';
import { depositFor } from '../invoices/invoice-totals';
import { mailOffice } from './office-mail';
import { paymentsContext } from './payments-context';
import { quoteGrossMinor } from './quote-money';

const newToken = () => randomBytes(24).toString('base64url');

export class PaymentsOffError extends ConflictError {
  constructor() {
    super('card payments are not set up on this server (STRIPE_SECRET_KEY and STRIPE_WEBHOOK_SECRET)', 'payments_off');
  }
}

/** Webhook events that mean "the money arrived". */
const PAID_EVENTS = new Set(['checkout.session.completed', 'checkout.session.async_payment_succeeded']);

export function createPaymentsService(deps: AppDeps) {
  const ctx = paymentsContext(deps);
  const sequelize = deps.sequelize;

  async function settingsOf(organisationId: string): Promise<PaymentSettings> {
    const row = await PaymentSetting.findByPk(organisationId);
    const company = await loadCompanySettings(organisationId);
    return {
      depositMode: row?.depositMode ?? 'none',
      depositPercentBp: row?.depositPercentBp ?? null,
      depositFixedMinor: row?.depositFixedMinor ?? null,
      paymentTermsDays: row?.paymentTermsDays ?? 14,
      currency: company.currency,
    };
  }

  async function depositDue(quote: Quote): Promise<number> {
    const s = await settingsOf(quote.organisationId);
    return depositFor(await quoteGrossMinor(quote), s.depositMode, s.depositPercentBp, s.depositFixedMinor);
  }

  /** Open a Checkout Session for a payment row and store its id and url. */
  async function openCheckout(p: Payment, description: string, reference: string, customerEmail: string | null): Promise<string> {
    if (!ctx.gateway) throw new PaymentsOffError();
    const session = await ctx.gateway.createCheckout({
      amountMinor: p.amountMinor,
      currency: p.currency,
      description,
      reference,
      metadata: {
        paymentId: p.id,
        purpose: p.purpose,
        organisationId: p.organisationId,
        ...(p.quoteId ? { quoteId: p.quoteId } : {}),
        ...(p.invoiceId ? { invoiceId: p.invoiceId } : {}),
      },
      successUrl: `${ctx.appUrl}/pay/done/${p.token}`,
      cancelUrl: `${ctx.appUrl}/pay/cancelled/${p.token}`,
      customerEmail,
      idempotencyKey: `quiltline-payment-${p.id}`,
    });
    if (!session.url) throw new BadRequestError('the payment service returned no checkout page');
    await p.update({ checkoutSessionId: session.id, checkoutUrl: session.url });
    return session.url;
  }

  /** Expire older open sessions of the same thing, so an old tab cannot take a second payment. */
  async function expireOpen(where: { quoteId?: string; invoiceId?: string; purpose: 'deposit' | 'balance' }) {
    const open = await Payment.findAll({ where: { ...where, status: 'open' } });
    for (const p of open) {
      if (p.checkoutSessionId && ctx.gateway) {
        try {
          await ctx.gateway.expireCheckout(p.checkoutSessionId);
        } catch {
          // Already completed or expired at the service: the webhook decides; leave the row as it is.
          continue;
        }
      }
      await p.update({ status: 'expired' });
    }
  }

  async function customerEmailOfJob(jobId: string): Promise<string | null> {
    const job = await Job.findByPk(jobId, { include: ['customer'] });
    return job?.customer?.email || null;
  }

  const service = {
    settingsOf,

    async updateSettings(organisationId: string, body: PaymentSettingsBody): Promise<PaymentSettings> {
      await PaymentSetting.upsert({
        organisationId,
        depositMode: body.depositMode,
        depositPercentBp: body.depositMode === 'percent' ? (body.depositPercentBp ?? null) : null,
        depositFixedMinor: body.depositMode === 'fixed' ? (body.depositFixedMinor ?? null) : null,
        paymentTermsDays: body.paymentTermsDays,
      });
      return settingsOf(organisationId);
    },

    provider: ctx.provider,

    /** The deposit state of one of the company's quotes (another company's id → 404). */
    async depositStatus(organisationId: string, quoteId: string): Promise<DepositStatus> {
      const quote = await Quote.findOne({ where: { id: quoteId, organisationId } });
      if (!quote) throw new NotFoundError('quote');
      return service.depositStatusOf(quote);
    },

    async depositStatusOf(quote: Quote): Promise<DepositStatus> {
      const payments = await Payment.findAll({ where: { quoteId: quote.id, purpose: 'deposit' }, order: [['createdAt', 'ASC']] });
      const paid = payments.find((p) => p.status === 'paid');
      if (paid)
        return {
          quoteId: quote.id,
          state: 'paid',
          amountMinor: paid.amountMinor,
          currency: paid.currency,
          paidAt: paid.paidAt?.toISOString() ?? null,
          attempts: payments.length,
        };
      const amount = await depositDue(quote);
      return { quoteId: quote.id, state: amount > 0 ? 'due' : 'none', amountMinor: amount, currency: quote.currency, paidAt: null, attempts: payments.length };
    },

    /**
     * Start paying the deposit of an accepted quote: a new Checkout Session for the amount due.
     * Returns the hosted checkout's url, or null when nothing is due (none asked, or already paid).
     */
    async startDeposit(quote: Quote): Promise<string | null> {
      if (quote.status !== 'accepted') throw new ConflictError('the deposit is taken once the quote is accepted', 'quote_not_accepted');
      const status = await service.depositStatusOf(quote);
      if (status.state !== 'due') return null;
      if (!ctx.gateway) throw new PaymentsOffError();
      await expireOpen({ quoteId: quote.id, purpose: 'deposit' });
      const p = await Payment.create({
        organisationId: quote.organisationId,
        jobId: quote.jobId,
        quoteId: quote.id,
        invoiceId: null,
        purpose: 'deposit',
        amountMinor: status.amountMinor,
        currency: quote.currency,
        token: newToken(),
        checkoutSessionId: null,
        checkoutUrl: null,
      });
      return openCheckout(p, `Deposit for quote ${quote.number}`, quote.number, await customerEmailOfJob(quote.jobId));
    },

    /** Start paying an invoice's balance; null when nothing is left to pay. */
    async startBalance(invoice: Invoice, balanceMinor: number): Promise<string | null> {
      if (invoice.kind !== 'invoice' || invoice.status === 'paid' || balanceMinor <= 0) return null;
      if (!ctx.gateway) throw new PaymentsOffError();
      await expireOpen({ invoiceId: invoice.id, purpose: 'balance' });
      const p = await Payment.create({
        organisationId: invoice.organisationId,
        jobId: invoice.jobId,
        quoteId: invoice.quoteId,
        invoiceId: invoice.id,
        purpose: 'balance',
        amountMinor: balanceMinor,
        currency: invoice.currency,
        token: newToken(),
        checkoutSessionId: null,
        checkoutUrl: null,
      });
      return openCheckout(p, `Invoice ${invoice.number}`, invoice.number, invoice.customerEmail || null);
    },

    async paymentByToken(token: string): Promise<Payment> {
      const p = typeof token === 'string' && token.length <= 64 ? await Payment.findOne({ where: { token } }) : null;
      if (!p) throw new NotFoundError('payment');
      return p;
    },

    /**
     * Verify and apply one webhook delivery. Throws BadRequestError (→ 400) when the signature is
     * missing, wrong or stale — nothing is read or changed then. Each event id is applied once.
     */
    async handleWebhook(rawBody: Buffer, signature: string | undefined): Promise<{ duplicate: boolean; handled: boolean }> {
      if (!ctx.gateway) throw new PaymentsOffError();
      let event;
      try {
        event = ctx.gateway.verifyWebhook(rawBody, signature);
      } catch (e) {
        throw new BadRequestError(`webhook signature check failed: ${e instanceof Error ? e.message : 'invalid'}`, 'bad_signature');
      }
      const after: Array<() => Promise<void>> = [];
      const result = await sequelize.transaction(async (t) => {
        const inserted = await sequelize.query<{ event_id: string }>(
          'INSERT INTO payment_events (event_id, type, created_at) VALUES (:id, :type, now()) ON CONFLICT (event_id) DO NOTHING RETURNING event_id',
          { replacements: { id: event.id, type: event.type }, type: QueryTypes.SELECT, transaction: t },
        );
        if (inserted.length === 0) return { duplicate: true, handled: false };
        const session = event.data.object as { id?: string; payment_status?: string; amount_total?: number; currency?: string; payment_intent?: string | null };
        if (!session.id || !event.type.startsWith('checkout.session.')) return { duplicate: false, handled: false };
        const p = await Payment.findOne({ where: { checkoutSessionId: session.id }, transaction: t, lock: t.LOCK.UPDATE });
        if (!p) return { duplicate: false, handled: false };
        await sequelize.query('UPDATE payment_events SET organisation_id = :org, payment_id = :pid WHERE event_id = :id', {
          replacements: { org: p.organisationId, pid: p.id, id: event.id },
          transaction: t,
        });
        if (event.type === 'checkout.session.expired') {
          if (p.status === 'open') await p.update({ status: 'expired' }, { transaction: t });
          return { duplicate: false, handled: true };
        }
        if (!PAID_EVENTS.has(event.type) || session.payment_status !== 'paid' || p.status === 'paid') return { duplicate: false, handled: false };
        if (session.amount_total !== p.amountMinor || (session.currency ?? '').toLowerCase() !== p.currency.toLowerCase()) {
          // Never count money we did not ask for; the office sees it and sorts it out by hand.
          await recordJobEvent(
            p,
            'payment_mismatch',
            { paymentId: p.id, expectedMinor: p.amountMinor, receivedMinor: session.amount_total ?? null, currency: session.currency ?? null },
            t,
          );
          after.push(() =>
            mailOffice(
              deps.mailer,
              p.organisationId,
              'Payment received with an unexpected amount',
              `A card payment for ${p.purpose} arrived for ${session.amount_total} ${session.currency} but ${p.amountMinor} ${p.currency} was asked. Check it in the payment service's dashboard.`,
            ),
          );
          return { duplicate: false, handled: true };
        }
        const paidAt = new Date();
        await p.update({ status: 'paid', paidAt, paymentIntentId: session.payment_intent ?? null }, { transaction: t });
        await applyPaid(p, paidAt, t, after);
        return { duplicate: false, handled: true };
      });
      for (const job of after) {
        try {
          await job();
        } catch (e) {
          console.error('payments: follow-up after webhook failed:', e instanceof Error ? e.message : e);
        }
      }
      return result;
    },

    /** The money events of a job, oldest first. */
    async timeline(organisationId: string, jobId: string): Promise<PaymentTimelineEntry[]> {
      if (!(await Job.findOne({ where: { id: jobId, organisationId }, attributes: ['id'] }))) throw new NotFoundError('job');
      const events = await JobEvent.findAll({
        where: { organisationId, jobId, kind: { [Op.in]: ['deposit_paid', 'invoice_issued', 'invoice_paid', 'credit_note_issued', 'payment_refunded'] } },
        order: [['createdAt', 'ASC']],
      });
      const kindMap: Record<string, PaymentTimelineEntry['kind']> = {
        deposit_paid: 'deposit-paid',
        invoice_issued: 'invoice-issued',
        invoice_paid: 'invoice-paid',
        credit_note_issued: 'credit-note-issued',
        payment_refunded: 'refund',
      };
      return events.map((e) => {
        // `paymentText` (not `text`): price-like keys are stripped for installers (server/lib/redact.ts).
        const d = e.data as { amountMinor?: number; currency?: string; paymentText?: string };
        return {
          at: e.createdAt.toISOString(),
          kind: kindMap[e.kind],
          text: d.paymentText ?? e.kind,
          amountMinor: d.amountMinor ?? 0,
          currency: d.currency ?? 'GBP',
        };
      });
    },
  };

  async function recordJobEvent(p: Payment, kind: string, data: Record<string, unknown>, t: Transaction) {
    await JobEvent.create({ organisationId: p.organisationId, jobId: p.jobId, userId: null, kind, data } as never, { transaction: t });
  }

  async function applyPaid(p: Payment, paidAt: Date, t: Transaction, after: Array<() => Promise<void>>) {
    const money = formatMoney(p.amountMinor, p.currency);
    if (p.purpose === 'deposit') {
      const quote = p.quoteId ? await Quote.findByPk(p.quoteId, { transaction: t }) : null;
      const others = await Payment.count({ where: { quoteId: p.quoteId, purpose: 'deposit', status: 'paid', id: { [Op.ne]: p.id } }, transaction: t });
      if (others > 0) {
        // Paid twice (two tabs): give the second one back at once.
        await recordJobEvent(
          p,
          'payment_refunded',
          { paymentId: p.id, amountMinor: p.amountMinor, currency: p.currency, paymentText: `Second deposit payment of ${money} refunded` },
          t,
        );
        after.push(async () => {
          if (ctx.gateway && p.paymentIntentId) await ctx.gateway.refund(p.paymentIntentId, p.amountMinor, { reason: 'duplicate deposit', paymentId: p.id });
        });
        return;
      }
      const text = `Deposit of ${money} paid for quote ${quote?.number ?? ''}`.trim();
      await recordJobEvent(
        p,
        'deposit_paid',
        {
          paymentId: p.id,
          quoteId: p.quoteId,
          quoteNumber: quote?.number ?? null,
          amountMinor: p.amountMinor,
          currency: p.currency,
          paidAt: paidAt.toISOString(),
          paymentText: text,
        },
        t,
      );
      const job = await Job.findByPk(p.jobId, { include: ['customer'], transaction: t });
      after.push(() =>
        mailOffice(
          deps.mailer,
          p.organisationId,
          `Deposit paid: ${money} for quote ${quote?.number ?? ''}`,
          `${job?.customer?.name ?? 'The customer'} paid a deposit of ${money} for quote ${quote?.number ?? ''} (job ${job?.reference ?? ''}) on ${formatDate(paidAt)}.\n\nThe payment service's reference: ${p.paymentIntentId ?? p.checkoutSessionId}.`,
        ),
      );
      return;
    }
    if (p.invoiceId) {
      const inv = await Invoice.findByPk(p.invoiceId, { transaction: t, lock: t.LOCK.UPDATE });
      if (!inv) return;
      if (inv.status !== 'paid') await inv.update({ status: 'paid', paidAt }, { transaction: t });
      const text = `Invoice ${inv.number} paid: ${money}`;
      await recordJobEvent(
        p,
        'invoice_paid',
        {
          paymentId: p.id,
          invoiceId: inv.id,
          invoiceNumber: inv.number,
          amountMinor: p.amountMinor,
          currency: p.currency,
          paidAt: paidAt.toISOString(),
          paymentText: text,
        },
        t,
      );
      after.push(() =>
        mailOffice(
          deps.mailer,
          p.organisationId,
          `Invoice ${inv.number} paid: ${money}`,
          `${inv.customerName} paid the balance of invoice ${inv.number}, ${money}, on ${formatDate(paidAt)}.`,
        ),
      );
    }
  }

  return service;
}

export type PaymentsService = ReturnType<typeof createPaymentsService>;
