import { randomBytes } from 'node:crypto';
import { Op, type Transaction } from 'sequelize';
import type { DepositStatus, PaymentSettings, PaymentSettingsBody, PaymentTimelineEntry } from '../../../shared/api/payments';
import type { AppDeps } from '../../deps';
import { Invoice } from '../../db/models/invoice';
import { Job } from '../../db/models/job';
import { JobEvent } from '../../db/models/job-event';
import { Payment } from '../../db/models/payment';
import { PaymentSetting } from '../../db/models/payment-setting';
import { Quote } from '../../db/models/quote';
import { BadRequestError, ConflictError, NotFoundError } from '../../lib/errors';
import { depositFor } from '../../../shared/quote/deposit';
import { loadPaymentSettings } from '../settings/payment-settings';
import { PaymentsOffError, paymentsContext } from './payments-context';
import { createWebhookHandler } from './payments-webhook';
import { quoteGrossMinor } from './quote-money';

const newToken = () => randomBytes(24).toString('base64url');

export { PaymentsOffError };

export function createPaymentsService(deps: AppDeps) {
  const ctx = paymentsContext(deps);
  const sequelize = deps.sequelize;

  const settingsOf = loadPaymentSettings;

  async function depositDue(quote: Quote): Promise<number> {
    const s = await settingsOf(quote.organisationId);
    return depositFor(await quoteGrossMinor(quote), s.depositMode, s.depositPercentBp, s.depositFixedMinor);
  }

  /** Open a Checkout Session for a payment row and store its id and url. */
  async function openCheckout(p: Payment, description: string, reference: string, customerEmail: string | null): Promise<string | null> {
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
    // Guarded: a newer checkout of the same thing may have replaced this row meanwhile; then this
    // session must not stay payable.
    const [n] = await Payment.update({ checkoutSessionId: session.id, checkoutUrl: session.url }, { where: { id: p.id, status: 'open' } });
    if (n !== 1) {
      await Payment.update({ checkoutSessionId: session.id }, { where: { id: p.id } });
      await expireAtService([session.id]);
      return null;
    }
    return session.url;
  }

  /** Expires hosted sessions; one that is no longer open (paid meanwhile) is left to the webhook, which refunds it. */
  async function expireAtService(sessionIds: Array<string | null>) {
    for (const id of sessionIds) {
      if (!id || !ctx.gateway) continue;
      try {
        await ctx.gateway.expireCheckout(id);
      } catch (e) {
        deps.logger.warn(`payments: could not expire checkout ${id}: ${e instanceof Error ? e.message : String(e)}`);
      }
    }
  }

  /**
   * Marks every open checkout of one thing expired inside the caller's transaction (the thing's row
   * is locked by the caller) and returns the hosted sessions to expire once it commits. From then on
   * a completion of any of them is refunded by the webhook instead of counted.
   */
  async function expireOpenRows(
    where: { quoteId?: string; invoiceId?: string; purpose: 'deposit' | 'balance' },
    t: Transaction,
  ): Promise<Array<string | null>> {
    const open = await Payment.findAll({ where: { ...where, status: 'open' }, transaction: t, lock: t.LOCK.UPDATE });
    for (const p of open) await p.update({ status: 'expired' }, { transaction: t });
    return open.map((p) => p.checkoutSessionId);
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

    async depositStatusOf(quote: Quote, t?: Transaction): Promise<DepositStatus> {
      const payments = await Payment.findAll({ where: { quoteId: quote.id, purpose: 'deposit' }, order: [['createdAt', 'ASC']], transaction: t });
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
      if (!ctx.gateway) throw new PaymentsOffError();
      // Two tabs starting at once queue on the quote's row: the later one replaces the earlier.
      const started = await sequelize.transaction(async (t) => {
        const q = await Quote.findByPk(quote.id, { transaction: t, lock: t.LOCK.UPDATE });
        if (!q || q.status !== 'accepted') throw new ConflictError('the deposit is taken once the quote is accepted', 'quote_not_accepted');
        const status = await service.depositStatusOf(q, t);
        if (status.state !== 'due') return null;
        const stale = await expireOpenRows({ quoteId: q.id, purpose: 'deposit' }, t);
        const p = await Payment.create(
          {
            organisationId: q.organisationId,
            jobId: q.jobId,
            quoteId: q.id,
            invoiceId: null,
            purpose: 'deposit',
            amountMinor: status.amountMinor,
            currency: q.currency,
            token: newToken(),
            checkoutSessionId: null,
            checkoutUrl: null,
          },
          { transaction: t },
        );
        return { p, stale, q };
      });
      if (!started) return null;
      await expireAtService(started.stale);
      return openCheckout(started.p, `Deposit for quote ${started.q.number}`, started.q.number, await customerEmailOfJob(started.q.jobId));
    },

    /**
     * Start paying an invoice's balance; null when nothing is left to pay. `balanceOf` works the
     * balance out from the invoice row as locked here, so an edit or credit note cannot slip between.
     */
    async startBalance(invoice: Invoice, balanceOf: (locked: Invoice, t: Transaction) => Promise<number>): Promise<string | null> {
      if (invoice.kind !== 'invoice' || invoice.status === 'paid') return null;
      if (!ctx.gateway) throw new PaymentsOffError();
      const started = await sequelize.transaction(async (t) => {
        const inv = await Invoice.findByPk(invoice.id, { transaction: t, lock: t.LOCK.UPDATE });
        if (!inv || inv.status !== 'issued') return null;
        const balanceMinor = await balanceOf(inv, t);
        if (balanceMinor <= 0) return null;
        const stale = await expireOpenRows({ invoiceId: inv.id, purpose: 'balance' }, t);
        const p = await Payment.create(
          {
            organisationId: inv.organisationId,
            jobId: inv.jobId,
            quoteId: inv.quoteId,
            invoiceId: inv.id,
            purpose: 'balance',
            amountMinor: balanceMinor,
            currency: inv.currency,
            token: newToken(),
            checkoutSessionId: null,
            checkoutUrl: null,
          },
          { transaction: t },
        );
        return { p, stale };
      });
      if (!started) return null;
      await expireAtService(started.stale);
      return openCheckout(started.p, `Invoice ${invoice.number}`, invoice.number, invoice.customerEmail || null);
    },

    /**
     * For edits that change what is owed (invoice changes, credit notes): call inside the edit's
     * transaction, with the invoice row locked; run the returned function after commit.
     */
    async expireBalanceCheckouts(invoiceId: string, t: Transaction): Promise<() => Promise<void>> {
      const stale = await expireOpenRows({ invoiceId, purpose: 'balance' }, t);
      return () => expireAtService(stale);
    },

    async paymentByToken(token: string): Promise<Payment> {
      const p = typeof token === 'string' && token.length <= 64 ? await Payment.findOne({ where: { token } }) : null;
      if (!p) throw new NotFoundError('payment');
      return p;
    },

    /** Verify and apply one webhook delivery (payments-webhook.ts). */
    handleWebhook: createWebhookHandler(deps, ctx),

    /** The money events of a job, oldest first. */
    async timeline(organisationId: string, jobId: string): Promise<PaymentTimelineEntry[]> {
      if (!(await Job.findOne({ where: { id: jobId, organisationId }, attributes: ['id'] }))) throw new NotFoundError('job');
      const events = await JobEvent.findAll({
        where: { organisationId, jobId, kind: { [Op.in]: ['deposit_paid', 'invoice_issued', 'invoice_paid', 'credit_note_issued', 'payment_refunded'] } },
        order: [
          ['createdAt', 'ASC'],
          ['seq', 'ASC'],
        ],
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

  return service;
}

export type PaymentsService = ReturnType<typeof createPaymentsService>;
