import { Op } from 'sequelize';
import type { CreditNoteCreate, Invoice as InvoiceDto, InvoiceLineInput } from '../../../shared/api/invoices';
import { formatMoney } from '../../../shared/quote/money';
import { todayIso } from '../../../shared/dates';
import type { AppDeps } from '../../deps';
import { Invoice } from '../../db/models/invoice';
import { Payment } from '../../db/models/payment';
import { BadRequestError, ConflictError, ValidationError } from '../../lib/errors';
import { paymentsContext } from '../payments/payments-context';
import type { PaymentsService } from '../payments/payments.service';
import { creditedTotal } from './invoice-dto';
import type { Actor, InvoiceDocuments } from './invoice-documents';
import { insertLines, priceInputs, ratesOf } from './invoice-lines';
import { formatNumber, SERIES, takeNumber } from './invoice-numbering';
import { sumLines } from './invoice-totals';

/** Credit notes against an invoice, and paying a credit back to the card. */
export function createCreditNotes(deps: AppDeps, payments: PaymentsService, docs: InvoiceDocuments, mailDocument: (inv: Invoice) => Promise<boolean>) {
  const { sequelize } = deps;
  const ctx = paymentsContext(deps);
  const { find, creditNotesOf, dto, event } = docs;

  /** Issue a credit note against an invoice; optionally pay it back to the card. */
  async function creditNote(
    actor: Actor,
    invoiceId: string,
    body: CreditNoteCreate & { lines: InvoiceLineInput[]; refund: boolean; reason: string },
  ): Promise<InvoiceDto> {
    const rates = await ratesOf(actor.organisationId);
    const issueDate = todayIso();
    const rows = priceInputs(body.lines, 'credit', rates, issueDate, 'lines');
    const totals = sumLines(rows);
    if (totals.grossMinor <= 0) throw new ValidationError([{ path: 'lines', message: 'a credit note must credit more than nothing' }]);
    let expireAtService = async () => {};
    const created = await sequelize.transaction(async (t) => {
      const inv = await find(actor, invoiceId, t);
      if (inv.kind !== 'invoice') throw new ConflictError('credit notes are issued against invoices', 'not_an_invoice');
      if (body.refund && inv.status !== 'paid') {
        throw new ValidationError([
          { path: 'refund', message: 'this invoice is not paid yet: the credit reduces what is left to pay, there is nothing to refund' },
        ]);
      }
      const already = creditedTotal(await creditNotesOf(inv, t));
      if (already + totals.grossMinor > inv.grossMinor) {
        throw new ValidationError([
          { path: 'lines', message: `at most ${formatMoney(inv.grossMinor - already, inv.currency)} is left to credit on ${inv.number}` },
        ]);
      }
      const seq = await takeNumber(deps, actor.organisationId, SERIES.credit_note, t);
      const cn = await Invoice.create(
        {
          organisationId: actor.organisationId,
          jobId: inv.jobId,
          quoteId: inv.quoteId,
          kind: 'credit_note',
          series: SERIES.credit_note,
          seq,
          number: formatNumber(SERIES.credit_note, seq),
          creditedInvoiceId: inv.id,
          issueDate,
          dueDate: null,
          currency: inv.currency,
          customerName: inv.customerName,
          customerEmail: inv.customerEmail,
          billingAddress: inv.billingAddress,
          netMinor: totals.netMinor,
          taxMinor: totals.taxMinor,
          grossMinor: totals.grossMinor,
          depositMinor: 0,
          reason: body.reason,
          payToken: null,
          createdById: actor.id,
        },
        { transaction: t },
      );
      await insertLines(cn, rows, t);
      await event(
        cn,
        actor.id,
        'credit_note_issued',
        {
          invoiceId: inv.id,
          creditNoteId: cn.id,
          creditNoteNumber: cn.number,
          amountMinor: cn.grossMinor,
          currency: cn.currency,
          paymentText: `Credit note ${cn.number} for ${formatMoney(cn.grossMinor, cn.currency)} against ${inv.number}`,
        },
        t,
      );
      expireAtService = await payments.expireBalanceCheckouts(inv.id, t);
      return cn;
    });
    await expireAtService();
    if (body.refund) await refundCredit(actor, invoiceId, created);
    await mailDocument(created);
    return dto(created);
  }

  /** Pay a credit back to the card(s) that paid the invoice's job: balance payment first, then the deposit. */
  async function refundCredit(actor: Actor, invoiceId: string, cn: Invoice) {
    if (!ctx.gateway) throw new BadRequestError('card payments are not set up on this server, so nothing can be refunded by card');
    const inv = await find(actor, invoiceId);
    const paid = await Payment.findAll({
      where: {
        organisationId: actor.organisationId,
        status: 'paid',
        [Op.or]: [{ invoiceId: inv.id }, ...(inv.quoteId ? [{ quoteId: inv.quoteId, purpose: 'deposit' }] : [])],
      },
      order: [['purpose', 'ASC']], // 'balance' before 'deposit'
    });
    let left = cn.grossMinor;
    for (const p of paid) {
      if (left <= 0 || !p.paymentIntentId) continue;
      const amount = Math.min(left, p.amountMinor);
      let r;
      try {
        r = await ctx.gateway.refund(p.paymentIntentId, amount, { creditNote: cn.number, paymentId: p.id });
      } catch (e) {
        // The credit note stands; the office refunds by hand and sees why here.
        await event(cn, actor.id, 'refund_failed', {
          paymentId: p.id,
          creditNoteNumber: cn.number,
          amountMinor: amount,
          currency: cn.currency,
          paymentText: `Card refund of ${formatMoney(amount, cn.currency)} failed: ${e instanceof Error ? e.message : 'error'}`,
        });
        continue;
      }
      left -= r.amountMinor;
      await event(cn, actor.id, 'payment_refunded', {
        paymentId: p.id,
        refundId: r.id,
        creditNoteNumber: cn.number,
        amountMinor: r.amountMinor,
        currency: r.currency.toUpperCase(),
        paymentText: `Refunded ${formatMoney(r.amountMinor, r.currency.toUpperCase())} to the card for ${cn.number}`,
      });
    }
  }

  return { creditNote };
}
