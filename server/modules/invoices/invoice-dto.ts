import type { Invoice as InvoiceDto, InvoiceSummary } from '../../../shared/api/invoices';
import type { Invoice } from '../../db/models/invoice';
import type { InvoiceLine } from '../../db/models/invoice-line';
import { todayIso } from '../../../shared/dates';
import { balanceDue, isOverdue, sumLines } from './invoice-totals';

export interface InvoiceContext {
  jobReference: string;
  quoteReference: string | null;
  creditedInvoiceNumber: string | null;
  /** credit notes issued against this invoice (empty for a credit note) */
  creditNotes: Invoice[];
  appUrl: string;
}

/** Total of the credit notes against an invoice, minor units. */
export function creditedTotal(creditNotes: readonly Invoice[]): number {
  return creditNotes.reduce((sum, c) => sum + c.grossMinor, 0);
}

/** What is left to pay on an invoice; 0 for a paid invoice or a credit note. */
export function balanceOf(inv: Invoice, creditNotes: readonly Invoice[]): number {
  if (inv.kind !== 'invoice' || inv.status === 'paid') return 0;
  return balanceDue(inv.grossMinor, inv.depositMinor, creditedTotal(creditNotes));
}

export function toSummary(inv: Invoice, ctx: Pick<InvoiceContext, 'jobReference' | 'creditNotes'>, today = todayIso()): InvoiceSummary {
  const balance = balanceOf(inv, ctx.creditNotes);
  return {
    id: inv.id,
    kind: inv.kind,
    number: inv.number,
    jobId: inv.jobId,
    jobReference: ctx.jobReference,
    customerName: inv.customerName,
    status: inv.status,
    overdue: inv.kind === 'invoice' && balance > 0 && isOverdue(inv.status, inv.dueDate, today),
    issueDate: inv.issueDate,
    dueDate: inv.dueDate,
    currency: inv.currency,
    grossMinor: inv.grossMinor,
    balanceMinor: balance,
    paidAt: inv.paidAt ? inv.paidAt.toISOString() : null,
  };
}

export function toInvoiceDto(inv: Invoice, lines: InvoiceLine[], ctx: InvoiceContext, today = todayIso()): InvoiceDto {
  const sorted = [...lines].sort((a, b) => a.position - b.position);
  const dtoLines = sorted.map((l) => ({
    id: l.id,
    position: l.position,
    source: l.source,
    description: l.description,
    quantity: Number(l.quantity),
    unit: l.unit,
    unitPriceMinor: l.unitPriceMinor,
    taxClass: l.taxClass,
    rateBp: l.rateBp,
    netMinor: l.netMinor,
    taxMinor: l.taxMinor,
    grossMinor: l.netMinor + l.taxMinor,
  }));
  const totals = sumLines(dtoLines);
  const summary = toSummary(inv, ctx, today);
  return {
    ...summary,
    quoteId: inv.quoteId,
    quoteReference: ctx.quoteReference,
    creditedInvoiceId: inv.creditedInvoiceId,
    creditedInvoiceNumber: ctx.creditedInvoiceNumber,
    customerEmail: inv.customerEmail,
    billingAddress: inv.billingAddress,
    lines: dtoLines,
    netMinor: inv.netMinor,
    taxMinor: inv.taxMinor,
    taxByRate: totals.taxByRate,
    depositMinor: inv.depositMinor,
    creditedMinor: creditedTotal(ctx.creditNotes),
    notes: inv.notes,
    reason: inv.reason,
    creditNotes: ctx.creditNotes.map((c) => toSummary(c, { jobReference: ctx.jobReference, creditNotes: [] }, today)),
    sentAt: inv.sentAt ? inv.sentAt.toISOString() : null,
    payUrl: inv.kind === 'invoice' && inv.payToken ? `${ctx.appUrl}/pay/invoice/${inv.payToken}` : null,
  };
}
