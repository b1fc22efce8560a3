import { Op, QueryTypes, type Transaction } from 'sequelize';
import { formatDate } from '../../../shared/dates';
import { formatMoney } from '../../../shared/quote/money';
import type { AppDeps } from '../../deps';
import { Invoice } from '../../db/models/invoice';
import { Job } from '../../db/models/job';
import { JobEvent } from '../../db/models/job-event';
import { Payment } from '../../db/models/payment';
import { Quote } from '../../db/models/quote';
import { BadRequestError } from '../../lib/errors';
import { mailOffice } from './office-mail';
import { PaymentsOffError, type PaymentsContext } from './payments-context';

/** Webhook events that mean "the money arrived". */
const PAID_EVENTS = new Set(['checkout.session.completed', 'checkout.session.async_payment_succeeded']);

type After = Array<() => Promise<void>>;
interface SessionObject {
  id?: string;
  payment_status?: string;
  amount_total?: number;
  currency?: string;
  payment_intent?: string | null;
}

/**
 * Applies the payment service's signed events. Every change is a guarded transition inside one
 * transaction: the thing being paid for (the invoice, else the quote) is locked first, then the
 * payment row (the same order as edits and new checkouts take them, so they queue rather than
 * deadlock). A completion is counted only for an `open` row whose deposit or invoice still wants
 * it; any other completion (an expired or replaced checkout, a second deposit) is refunded in full
 * automatically and the office is told.
 */
export function createWebhookHandler(deps: AppDeps, ctx: PaymentsContext) {
  const sequelize = deps.sequelize;

  async function recordJobEvent(p: Payment, kind: string, data: Record<string, unknown>, t?: Transaction) {
    await JobEvent.create({ organisationId: p.organisationId, jobId: p.jobId, userId: null, kind, data } as never, { transaction: t });
  }

  /** Marks the row refunded now; the refund itself goes out after commit (a network call holds no lock). */
  async function refundUncounted(p: Payment, why: string, paymentIntentId: string | null, t: Transaction, after: After) {
    const money = formatMoney(p.amountMinor, p.currency);
    await p.update({ status: 'refunded', paidAt: new Date(), paymentIntentId }, { transaction: t });
    await recordJobEvent(
      p,
      'payment_refunded',
      {
        paymentId: p.id,
        amountMinor: p.amountMinor,
        currency: p.currency,
        reason: why,
        paymentText: `Card payment of ${money} refunded automatically: ${why}`,
      },
      t,
    );
    after.push(async () => {
      let outcome = `${money} was refunded to the customer's card automatically.`;
      try {
        if (!ctx.gateway || !paymentIntentId) throw new Error('the payment service gave no payment reference');
        await ctx.gateway.refund(paymentIntentId, p.amountMinor, { reason: why, paymentId: p.id });
      } catch (e) {
        outcome = `The automatic refund of ${money} FAILED (${e instanceof Error ? e.message : 'error'}): refund it by hand in the payment service's dashboard.`;
        await recordJobEvent(p, 'refund_failed', { paymentId: p.id, amountMinor: p.amountMinor, currency: p.currency, paymentText: outcome });
      }
      await mailOffice(
        deps.mailer,
        p.organisationId,
        `Card payment refunded: ${money} (${p.purpose})`,
        `A card payment of ${money} for the ${p.purpose} arrived but was not counted: ${why}.\n${outcome}\nReference: ${paymentIntentId ?? p.checkoutSessionId}.`,
      );
    });
  }

  /** Why this completion must not count, or null when it should. The parent row is locked. */
  async function reasonToRefund(p: Payment, parent: Quote | Invoice | null, t: Transaction): Promise<string | null> {
    if (p.status === 'expired') return 'the checkout had been replaced or its amount changed before it was paid';
    if (p.status !== 'open') return `the payment was ${p.status}`;
    if (p.purpose === 'deposit') {
      if (!(parent instanceof Quote) || parent.status !== 'accepted') return 'the quote is no longer accepted';
      const others = await Payment.count({ where: { quoteId: p.quoteId, purpose: 'deposit', status: 'paid', id: { [Op.ne]: p.id } }, transaction: t });
      if (others > 0) return 'the deposit had already been paid (a second tab or a retry)';
      return null;
    }
    if (!(parent instanceof Invoice)) return 'the invoice no longer exists';
    if (parent.status === 'paid') return 'the invoice had already been paid';
    return null;
  }

  async function applyPaid(p: Payment, parent: Quote | Invoice | null, paidAt: Date, t: Transaction, after: After) {
    const money = formatMoney(p.amountMinor, p.currency);
    if (p.purpose === 'deposit') {
      const quote = parent as Quote;
      const text = `Deposit of ${money} paid for quote ${quote.number}`;
      await recordJobEvent(
        p,
        'deposit_paid',
        {
          paymentId: p.id,
          quoteId: p.quoteId,
          quoteNumber: quote.number,
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
          `Deposit paid: ${money} for quote ${quote.number}`,
          `${job?.customer?.name ?? 'The customer'} paid a deposit of ${money} for quote ${quote.number} (job ${job?.reference ?? ''}) on ${formatDate(paidAt)}.\n\nThe payment service's reference: ${p.paymentIntentId ?? p.checkoutSessionId}.`,
        ),
      );
      return;
    }
    const inv = parent as Invoice;
    // Guarded: only an issued invoice becomes paid.
    await Invoice.update({ status: 'paid', paidAt }, { where: { id: inv.id, status: 'issued' }, transaction: t });
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
        paymentText: `Invoice ${inv.number} paid: ${money}`,
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

  /**
   * Verify and apply one webhook delivery. Throws BadRequestError (→ 400) when the signature is
   * missing, wrong or stale — nothing is read or changed then. Each event id is applied once.
   */
  return async function handleWebhook(rawBody: Buffer, signature: string | undefined): Promise<{ duplicate: boolean; handled: boolean }> {
    if (!ctx.gateway) throw new PaymentsOffError();
    let event;
    try {
      event = ctx.gateway.verifyWebhook(rawBody, signature);
    } catch (e) {
      throw new BadRequestError(`webhook signature check failed: ${e instanceof Error ? e.message : 'invalid'}`, 'bad_signature');
    }
    const after: After = [];
    const result = await sequelize.transaction(async (t) => {
      const inserted = await sequelize.query<{ event_id: string }>(
        'INSERT INTO payment_events (event_id, type, created_at) VALUES (:id, :type, now()) ON CONFLICT (event_id) DO NOTHING RETURNING event_id',
        { replacements: { id: event.id, type: event.type }, type: QueryTypes.SELECT, transaction: t },
      );
      if (inserted.length === 0) return { duplicate: true, handled: false };
      const session = event.data.object as SessionObject;
      if (!session.id || !event.type.startsWith('checkout.session.')) return { duplicate: false, handled: false };
      const found = await Payment.findOne({ where: { checkoutSessionId: session.id }, transaction: t });
      if (!found) return { duplicate: false, handled: false };
      // Lock order: invoice (or quote), then the payment row.
      const parent = found.invoiceId
        ? await Invoice.findByPk(found.invoiceId, { transaction: t, lock: t.LOCK.UPDATE })
        : found.quoteId
          ? await Quote.findByPk(found.quoteId, { transaction: t, lock: t.LOCK.UPDATE })
          : null;
      const p = (await Payment.findByPk(found.id, { transaction: t, lock: t.LOCK.UPDATE }))!;
      await sequelize.query('UPDATE payment_events SET organisation_id = :org, payment_id = :pid WHERE event_id = :id', {
        replacements: { org: p.organisationId, pid: p.id, id: event.id },
        transaction: t,
      });
      if (event.type === 'checkout.session.expired') {
        if (p.status === 'open') await p.update({ status: 'expired' }, { transaction: t });
        return { duplicate: false, handled: true };
      }
      if (!PAID_EVENTS.has(event.type) || session.payment_status !== 'paid' || p.status === 'paid' || p.status === 'refunded')
        return { duplicate: false, handled: false };
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
      const why = await reasonToRefund(p, parent, t);
      if (why) {
        await refundUncounted(p, why, session.payment_intent ?? null, t, after);
        return { duplicate: false, handled: true };
      }
      const paidAt = new Date();
      await p.update({ status: 'paid', paidAt, paymentIntentId: session.payment_intent ?? null }, { transaction: t });
      await applyPaid(p, parent, paidAt, t, after);
      return { duplicate: false, handled: true };
    });
    for (const job of after) {
      try {
        await job();
      } catch (e) {
        deps.logger.error(`payments: follow-up after webhook failed: ${e instanceof Error ? e.message : String(e)}`);
      }
    }
    return result;
  };
}
