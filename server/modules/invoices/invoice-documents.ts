import type { Transaction } from 'sequelize';
import type { Invoice as InvoiceDto } from '../../../shared/api/invoices';
import type { AppDeps } from '../../deps';
import { Invoice } from '../../db/models/invoice';
import { InvoiceLine } from '../../db/models/invoice-line';
import { Job } from '../../db/models/job';
import { JobEvent } from '../../db/models/job-event';
import { Quote } from '../../db/models/quote';
import { NotFoundError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import { loadCompanySettings } from '../settings/settings.service';
import { paymentsContext } from '../payments/payments-context';
import { toInvoiceDto } from './invoice-dto';
import { renderInvoicePdf, type CompanyDetails } from './invoice-pdf';

export type Actor = Pick<SessionUser, 'id' | 'organisationId'>;

/** Reading one invoice or credit note of a company: the row, its credit notes, its DTO and PDF, its job events. */
export function createInvoiceDocuments(deps: AppDeps) {
  const ctx = paymentsContext(deps);

  async function find(actor: Pick<Actor, 'organisationId'>, id: string, t?: Transaction): Promise<Invoice> {
    const inv = await Invoice.findOne({ where: { id, organisationId: actor.organisationId }, transaction: t, lock: t ? t.LOCK.UPDATE : undefined });
    if (!inv) throw new NotFoundError('invoice');
    return inv;
  }

  async function creditNotesOf(inv: Invoice, t?: Transaction): Promise<Invoice[]> {
    if (inv.kind !== 'invoice') return [];
    return Invoice.findAll({ where: { creditedInvoiceId: inv.id }, order: [['seq', 'ASC']], transaction: t });
  }

  async function pdfOf(inv: Invoice): Promise<{ filename: string; pdf: Buffer }> {
    return { filename: `${inv.number}.pdf`, pdf: await renderInvoicePdf(await dto(inv), await companyDetails(inv.organisationId)) };
  }

  async function dto(inv: Invoice): Promise<InvoiceDto> {
    const [lines, job, quote, credited, creditNotes] = await Promise.all([
      InvoiceLine.findAll({ where: { invoiceId: inv.id } }),
      Job.findByPk(inv.jobId),
      inv.quoteId ? Quote.findByPk(inv.quoteId) : null,
      inv.creditedInvoiceId ? Invoice.findByPk(inv.creditedInvoiceId) : null,
      creditNotesOf(inv),
    ]);
    return toInvoiceDto(inv, lines, {
      jobReference: job?.reference ?? '',
      quoteReference: quote?.number ?? null,
      creditedInvoiceNumber: credited?.number ?? null,
      creditNotes,
      appUrl: ctx.appUrl,
    });
  }

  async function companyDetails(organisationId: string): Promise<CompanyDetails> {
    const c = await loadCompanySettings(organisationId);
    const a = c.address;
    return {
      name: c.companyName,
      addressLines: [a.line1, a.line2, `${a.town} ${a.postcode}`.trim()].filter(Boolean),
      email: c.email,
      phone: c.phone || undefined,
      taxNumber: c.taxNumber || undefined,
    };
  }

  async function event(inv: Invoice, userId: string | null, kind: string, data: Record<string, unknown>, t?: Transaction) {
    await JobEvent.create({ organisationId: inv.organisationId, jobId: inv.jobId, userId, kind, data } as never, { transaction: t });
  }

  return { find, creditNotesOf, pdfOf, dto, companyDetails, event };
}

export type InvoiceDocuments = ReturnType<typeof createInvoiceDocuments>;
