import { randomBytes } from 'node:crypto';
import { Op } from 'sequelize';
import type { Invoice as InvoiceDto, InvoiceCreate, InvoiceLineInput, InvoiceListQuery, InvoicePatch, InvoiceSummary } from '../../../shared/api/invoices';
import { formatMoney } from '../../../shared/quote/money';
import type { AppDeps } from '../../deps';
import { Customer } from '../../db/models/customer';
import { Invoice } from '../../db/models/invoice';
import { InvoiceLine } from '../../db/models/invoice-line';
import { Job } from '../../db/models/job';
import { Quote } from '../../db/models/quote';
import { ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import type { PaymentsService } from '../payments/payments.service';
import { pricedQuoteLines } from '../payments/quote-money';
import { addDaysIso, todayIso } from '../../../shared/dates';
import { createCreditNotes } from './invoice-credit-notes';
import { createInvoiceDocuments, type Actor } from './invoice-documents';
import { balanceOf, toSummary } from './invoice-dto';
import { insertLines, priceInputs, ratesOf, type LineRow } from './invoice-lines';
import { createInvoiceMailer } from './invoice-mail';
import { formatNumber, SERIES, takeNumber } from './invoice-numbering';
import { sumLines } from './invoice-totals';

export { takeNumber } from './invoice-numbering';

export function createInvoicesService(deps: AppDeps, payments: PaymentsService) {
  const { sequelize } = deps;
  const docs = createInvoiceDocuments(deps);
  const { find, creditNotesOf, pdfOf, dto, companyDetails, event } = docs;
  const mailDocument = createInvoiceMailer(deps, docs);
  const { creditNote } = createCreditNotes(deps, payments, docs, mailDocument);

  const service = {
    dto,
    companyDetails,

    /** Office creates the invoice of an installed job: accepted quote + variations − deposit. */
    async create(actor: Actor, body: InvoiceCreate & { variations: InvoiceLineInput[]; notes: string; send: boolean }): Promise<InvoiceDto> {
      const job = await Job.findOne({ where: { id: body.jobId, organisationId: actor.organisationId } });
      if (!job) throw new NotFoundError('job');
      if (job.stage !== 'installed' && job.stage !== 'closed')
        throw new ConflictError(`an invoice is made once the job is installed (this job is ${job.stage})`, 'job_not_installed');
      const quote = await Quote.findOne({ where: { jobId: job.id, organisationId: actor.organisationId, status: 'accepted' }, order: [['version', 'DESC']] });
      if (!quote) throw new ConflictError('this job has no accepted quote to invoice', 'no_accepted_quote');
      const customer = await Customer.findByPk(job.customerId);
      const settings = await payments.settingsOf(actor.organisationId);
      const deposit = await payments.depositStatusOf(quote);
      const issueDate = todayIso();
      const priced = await pricedQuoteLines(quote);
      const quoteRows: LineRow[] = priced.lines.map((p) => ({
        source: 'quote',
        description: p.line.description,
        quantity: p.line.quantity,
        unit: p.line.unit,
        unitPriceMinor: p.line.unitPriceMinor,
        taxClass: p.line.taxClass,
        rateBp: p.rateBp,
        netMinor: p.netMinor,
        taxMinor: p.taxMinor,
      }));
      const variationRows = priceInputs(body.variations, 'variation', await ratesOf(actor.organisationId), issueDate, 'variations');
      const rows = [...quoteRows, ...variationRows];
      const totals = sumLines(rows);
      const existing = await Invoice.findOne({ where: { jobId: job.id, kind: 'invoice' } });
      if (existing) throw new ConflictError(`this job already has invoice ${existing.number}; correct it with a credit note`, 'invoice_exists');
      let inv: Invoice;
      try {
        inv = await sequelize.transaction(async (t) => {
          const seq = await takeNumber(deps, actor.organisationId, SERIES.invoice, t);
          const created = await Invoice.create(
            {
              organisationId: actor.organisationId,
              jobId: job.id,
              quoteId: quote.id,
              kind: 'invoice',
              series: SERIES.invoice,
              seq,
              number: formatNumber(SERIES.invoice, seq),
              creditedInvoiceId: null,
              issueDate,
              dueDate: addDaysIso(issueDate, settings.paymentTermsDays),
              currency: quote.currency,
              customerName: customer?.name ?? '',
              customerEmail: customer?.email ?? '',
              billingAddress: customer ? [customer.addressLine1, customer.addressLine2, customer.town, customer.postcode].filter(Boolean) : [],
              netMinor: totals.netMinor,
              taxMinor: totals.taxMinor,
              grossMinor: totals.grossMinor,
              depositMinor: deposit.state === 'paid' ? Math.min(deposit.amountMinor, totals.grossMinor) : 0,
              notes: body.notes,
              payToken: randomBytes(24).toString('base64url'),
              createdById: actor.id,
            },
            { transaction: t },
          );
          await insertLines(created, rows, t);
          await event(
            created,
            actor.id,
            'invoice_issued',
            {
              invoiceId: created.id,
              invoiceNumber: created.number,
              amountMinor: created.grossMinor,
              currency: created.currency,
              paymentText: `Invoice ${created.number} issued for ${formatMoney(created.grossMinor, created.currency)}`,
            },
            t,
          );
          return created;
        });
      } catch (e) {
        if ((e as { name?: string }).name === 'SequelizeUniqueConstraintError')
          throw new ConflictError('this job already has an invoice; correct it with a credit note', 'invoice_exists');
        throw e;
      }
      if (body.send) await mailDocument(inv);
      return dto(inv);
    },

    async list(actor: Pick<Actor, 'organisationId'>, q: InvoiceListQuery): Promise<InvoiceSummary[]> {
      const where: Record<string, unknown> = { organisationId: actor.organisationId };
      if (q.jobId) where.jobId = q.jobId;
      if (q.status === 'paid') where.status = 'paid';
      if (q.status === 'issued' || q.status === 'overdue') where.status = 'issued';
      const rows = await Invoice.findAll({
        where,
        order: [
          ['issueDate', 'DESC'],
          ['series', 'ASC'],
          ['seq', 'DESC'],
        ],
      });
      const jobs = await Job.findAll({ where: { id: { [Op.in]: [...new Set(rows.map((r) => r.jobId))] } }, attributes: ['id', 'reference'] });
      const refOf = new Map(jobs.map((j) => [j.id, j.reference]));
      const creditsOf = new Map<string, Invoice[]>();
      for (const r of rows) if (r.creditedInvoiceId) creditsOf.set(r.creditedInvoiceId, [...(creditsOf.get(r.creditedInvoiceId) ?? []), r]);
      // Credit notes of listed invoices that the filter left out still reduce their balance.
      const missing = await Invoice.findAll({
        where: {
          organisationId: actor.organisationId,
          kind: 'credit_note',
          creditedInvoiceId: { [Op.in]: rows.filter((r) => r.kind === 'invoice').map((r) => r.id) },
          id: { [Op.notIn]: rows.map((r) => r.id) },
        },
      });
      for (const c of missing) creditsOf.set(c.creditedInvoiceId!, [...(creditsOf.get(c.creditedInvoiceId!) ?? []), c]);
      const out = rows.map((r) => toSummary(r, { jobReference: refOf.get(r.jobId) ?? '', creditNotes: creditsOf.get(r.id) ?? [] }));
      return q.status === 'overdue' ? out.filter((s) => s.overdue) : out;
    },

    async get(actor: Pick<Actor, 'organisationId'>, id: string): Promise<InvoiceDto> {
      return dto(await find(actor, id));
    },

    async pdf(actor: Pick<Actor, 'organisationId'>, id: string): Promise<{ filename: string; pdf: Buffer }> {
      return pdfOf(await find(actor, id));
    },

    /** The PDF of an invoice already found (by the office's id or the customer's pay token). */
    pdfOf,

    async send(actor: Pick<Actor, 'organisationId'>, id: string): Promise<InvoiceDto> {
      const inv = await find(actor, id);
      if (!(await mailDocument(inv))) throw new ConflictError('the customer has no e-mail address: add one to the customer first', 'no_customer_email');
      return dto(inv);
    },

    /** Change an unpaid invoice; a paid one (or one with credit notes) is corrected by a credit note. */
    async update(actor: Actor, id: string, body: InvoicePatch): Promise<InvoiceDto> {
      const expireAtService = await sequelize.transaction(async (t) => {
        const inv = await find(actor, id, t);
        if (inv.kind !== 'invoice') throw new ConflictError('a credit note cannot be changed', 'credit_note_final');
        if (inv.status === 'paid') throw new ConflictError('a paid invoice cannot be changed: issue a credit note instead', 'invoice_paid');
        if ((await creditNotesOf(inv, t)).length)
          throw new ConflictError('this invoice has credit notes: issue another credit note instead', 'invoice_credited');
        const patch: Partial<Invoice['_creationAttributes']> = {};
        if (body.notes !== undefined) patch.notes = body.notes;
        if (body.dueDate !== undefined) {
          if (body.dueDate < inv.issueDate) throw new ValidationError([{ path: 'dueDate', message: 'the due date cannot be before the issue date' }]);
          patch.dueDate = body.dueDate;
        }
        if (body.variations) {
          const rows = priceInputs(body.variations as InvoiceLineInput[], 'variation', await ratesOf(inv.organisationId), inv.issueDate, 'variations');
          await InvoiceLine.destroy({ where: { invoiceId: inv.id, source: 'variation' }, transaction: t });
          const kept = await InvoiceLine.findAll({ where: { invoiceId: inv.id }, order: [['position', 'ASC']], transaction: t });
          await InvoiceLine.bulkCreate(
            rows.map((r, i) => ({ ...r, organisationId: inv.organisationId, invoiceId: inv.id, position: kept.length + i + 1 })),
            { transaction: t },
          );
          const totals = sumLines([...kept, ...rows]);
          Object.assign(patch, {
            netMinor: totals.netMinor,
            taxMinor: totals.taxMinor,
            grossMinor: totals.grossMinor,
            depositMinor: Math.min(inv.depositMinor, totals.grossMinor),
          });
        }
        await inv.update(patch, { transaction: t });
        // Any checkout opened for the old amount must not be paid now (a late completion is refunded).
        return payments.expireBalanceCheckouts(inv.id, t);
      });
      await expireAtService();
      return dto(await find(actor, id));
    },

    /** Issue a credit note against an invoice; optionally pay it back to the card. */
    creditNote,

    // ---- the customer's private link (no sign-in) ----
    async byPayToken(token: string): Promise<Invoice> {
      const inv = typeof token === 'string' && token.length <= 64 ? await Invoice.findOne({ where: { payToken: token, kind: 'invoice' } }) : null;
      if (!inv) throw new NotFoundError('invoice');
      return inv;
    },

    async startPayByToken(token: string): Promise<string | null> {
      const inv = await service.byPayToken(token);
      return payments.startBalance(inv, async (locked, t) => balanceOf(locked, await creditNotesOf(locked, t)));
    },
  };

  return service;
}

export type InvoicesService = ReturnType<typeof createInvoicesService>;
