import { randomBytes } from 'node:crypto';
import { Op, QueryTypes, type Transaction } from 'sequelize';
import type {
  CreditNoteCreate,
  Invoice as InvoiceDto,
  InvoiceCreate,
  InvoiceLineInput,
  InvoiceListQuery,
  InvoicePatch,
  InvoiceSummary,
} from '../../../shared/api/invoices';
import { formatMoney } from '../../../shared/quote/money';
import { taxRateOn, type DatedTaxRate } from '../../../shared/quote/tax';
import type { AppDeps } from '../../deps';
import { sendCompanyMail } from '../mail/mail.service';
import { Customer } from '../../db/models/customer';
import { Invoice } from '../../db/models/invoice';
import { InvoiceLine } from '../../db/models/invoice-line';
import { Job } from '../../db/models/job';
import { JobEvent } from '../../db/models/job-event';
import { Payment } from '../../db/models/payment';
import { Quote } from '../../db/models/quote';
import { TaxRate } from '../../db/models/tax-rate';
import { BadRequestError, ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import { ensureCompanySettings, loadCompanySettings } from '../settings/settings.service';
import { paymentsContext } from '../payments/payments-context';
import type { PaymentsService } from '../payments/payments.service';
import { pricedQuoteLines } from '../payments/quote-money';
import { addDaysIso, formatDate, todayIso } from '../../../shared/dates';
import { balanceOf, creditedTotal, toInvoiceDto, toSummary } from './invoice-dto';
import { renderInvoicePdf, type CompanyDetails } from './invoice-pdf';
import { lineAmounts, sumLines } from './invoice-totals';

type Actor = Pick<SessionUser, 'id' | 'organisationId'>;
interface LineRow {
  source: 'quote' | 'variation' | 'credit';
  description: string;
  quantity: number;
  unit: string;
  unitPriceMinor: number;
  taxClass: string | null;
  rateBp: number;
  netMinor: number;
  taxMinor: number;
}

const SERIES = { invoice: 'INV', credit_note: 'CN' } as const;
const formatNumber = (series: string, n: number) => `${series}-${String(n).padStart(6, '0')}`;

/**
 * Takes the next number of a company's series inside the caller's transaction. The UPDATE locks the
 * counter row until commit, so concurrent creators queue; a rolled-back insert gives its number back.
 */
export async function takeNumber(deps: Pick<AppDeps, 'sequelize'>, organisationId: string, series: string, t: Transaction): Promise<number> {
  const s = deps.sequelize;
  await s.query('INSERT INTO invoice_counters (organisation_id, series, next_number) VALUES (:org, :series, 1) ON CONFLICT DO NOTHING', {
    replacements: { org: organisationId, series },
    transaction: t,
  });
  const rows = await s.query<{ n: number }>(
    'UPDATE invoice_counters SET next_number = next_number + 1 WHERE organisation_id = :org AND series = :series RETURNING next_number - 1 AS n',
    { replacements: { org: organisationId, series }, type: QueryTypes.SELECT, transaction: t },
  );
  return Number(rows[0].n);
}

export function createInvoicesService(deps: AppDeps, payments: PaymentsService) {
  const { sequelize } = deps;
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

  async function ratesOf(organisationId: string): Promise<DatedTaxRate[]> {
    await ensureCompanySettings(organisationId); // a company's first invoice gives it the default rates (a write path)
    const rows = await TaxRate.findAll({ where: { organisationId } });
    return rows.map((r) => ({ taxClass: r.taxClass, rateBp: r.rateBp, validFrom: r.validFrom }));
  }

  /** Price lines the office typed, with the company's rate for each tax class on the document's date. */
  function priceInputs(
    inputs: readonly InvoiceLineInput[],
    source: 'variation' | 'credit',
    rates: DatedTaxRate[],
    dateIso: string,
    pathPrefix: string,
  ): LineRow[] {
    return inputs.map((l, i) => {
      let rateBp: number;
      try {
        rateBp = taxRateOn(rates, l.taxClass, dateIso).rateBp;
      } catch (e) {
        throw new ValidationError([{ path: `${pathPrefix}.${i}.taxClass`, message: e instanceof Error ? e.message : 'no tax rate' }]);
      }
      const a = lineAmounts({ quantity: l.quantity, unitPriceMinor: l.unitPriceMinor, rateBp });
      return {
        source,
        description: l.description,
        quantity: l.quantity,
        unit: l.unit ?? 'each',
        unitPriceMinor: l.unitPriceMinor,
        taxClass: l.taxClass,
        rateBp,
        netMinor: a.netMinor,
        taxMinor: a.taxMinor,
      };
    });
  }

  async function insertLines(inv: Invoice, rows: LineRow[], t: Transaction) {
    await InvoiceLine.bulkCreate(
      rows.map((r, i) => ({ ...r, organisationId: inv.organisationId, invoiceId: inv.id, position: i + 1 })),
      { transaction: t },
    );
  }

  async function event(inv: Invoice, userId: string | null, kind: string, data: Record<string, unknown>, t?: Transaction) {
    await JobEvent.create({ organisationId: inv.organisationId, jobId: inv.jobId, userId, kind, data } as never, { transaction: t });
  }

  async function mailDocument(inv: Invoice): Promise<boolean> {
    if (!inv.customerEmail) return false;
    const d = await dto(inv);
    const company = await companyDetails(inv.organisationId);
    const pdf = await renderInvoicePdf(d, company);
    const isCredit = inv.kind === 'credit_note';
    const title = isCredit ? `Credit note ${d.number}` : `Invoice ${d.number}`;
    const money = (m: number) => formatMoney(m, d.currency);
    const body = isCredit
      ? `Dear ${d.customerName},\n\nPlease find attached credit note ${d.number} for ${money(d.grossMinor)} against invoice ${d.creditedInvoiceNumber}.\n\n${d.reason}\n\n${company.name}`
      : [
          `Dear ${d.customerName},`,
          '',
          `Thank you for choosing ${company.name}. Please find attached invoice ${d.number} for the work at job ${d.jobReference}.`,
          '',
          `Total ${money(d.grossMinor)}${d.depositMinor ? `, less the deposit of ${money(d.depositMinor)} you paid` : ''}: ${money(d.balanceMinor)} to pay${d.dueDate ? ` by ${formatDate(d.dueDate)}` : ''}.`,
          '',
          d.payUrl && d.balanceMinor > 0 ? `Pay by card at this private link: ${d.payUrl}` : '',
          '',
          company.name,
        ].join('\n');
    await sendCompanyMail(
      deps,
      { organisationId: inv.organisationId, jobId: inv.jobId, userId: null, purpose: isCredit ? 'credit_note' : 'invoice', audience: 'customer' },
      {
        to: inv.customerEmail,
        subject: `${title} from ${company.name}`,
        text: body,
        attachments: [{ filename: `${d.number}.pdf`, content: pdf, contentType: 'application/pdf' }],
      },
    );
    await inv.update({ sentAt: new Date() });
    return true;
  }

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
    async creditNote(
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
    },

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

  return service;
}

export type InvoicesService = ReturnType<typeof createInvoicesService>;
