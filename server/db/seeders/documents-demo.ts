import type { JobStage } from '../../../shared/api/jobs';
import { addDaysIso, todayIso } from '../../../shared/dates';
import type { AppDeps } from '../../deps';
import { createInvoicesService } from '../../modules/invoices/invoices.service';
import { createPaymentsService } from '../../modules/payments/payments.service';
import { newLinkNonce } from '../../modules/quotes/quote-link';
import { createQuotesService } from '../../modules/quotes/quotes.service';
import type { SessionUser } from '../../types';
import { Customer, Invoice, Job, Organisation, Quote, User } from '../models';
import type { DemoMoment, DemoTimes } from './demo-history';

/** What a job at each stage has been sent and answered: the quote's state, and whether it is invoiced and paid. */
const DOCUMENTS_BY_STAGE: Partial<Record<JobStage, { quote: 'sent' | 'declined' | 'accepted'; invoice?: 'paid' }>> = {
  quoted: { quote: 'sent' },
  declined: { quote: 'declined' },
  accepted: { quote: 'accepted' },
  scheduled: { quote: 'accepted' },
  installed: { quote: 'accepted' },
  closed: { quote: 'accepted', invoice: 'paid' },
};

/** `iso` moved by as many days as lie from `from` to `to` (a document's other dates follow its issue date). */
function shiftIso(iso: string, from: string, to: string): string {
  return addDaysIso(iso, Math.round((Date.parse(to) - Date.parse(from)) / 86_400_000));
}

/**
 * Gives every demo job past the survey the quote (and, once closed, the paid invoice) its stage
 * implies, drafted from its stored takeoff by the quotes service like any other, dated at the
 * moments of its history (`times`); a job already holding a quote is left alone, so this is
 * idempotent. An installed job is left to invoice.
 */
export async function seedDemoDocuments(deps: AppDeps, organisationNames: string[], times: Map<string, DemoTimes>): Promise<void> {
  const quotes = createQuotesService(deps);
  const invoices = createInvoicesService(deps, createPaymentsService(deps));
  const at = (job: Job, moment: DemoMoment) => times.get(job.id)?.[moment] ?? new Date();
  // Numbered in the order they were issued, as the company's counters number them.
  const inOrderOf = (moment: DemoMoment) => (a: Job, b: Job) => at(a, moment).getTime() - at(b, moment).getTime();
  for (const name of organisationNames) {
    const org = await Organisation.findOne({ where: { name } });
    const office = org && (await User.findOne({ where: { organisationId: org.id, role: 'office', active: true } }));
    if (!org || !office) continue;
    const actor: SessionUser = { id: office.id, email: office.email, name: office.name, role: 'office', organisationId: org.id, organisationName: org.name };
    const quoted: Job[] = [];
    for (const job of (await Job.findAll({ where: { organisationId: org.id } })).sort(inOrderOf('drafted'))) {
      const wanted = DOCUMENTS_BY_STAGE[job.stage];
      if (!wanted || (await Quote.count({ where: { jobId: job.id } })) > 0) continue;
      const customer = await Customer.findByPk(job.customerId);
      const draft = await quotes.createFromJob(actor, job.id, {});
      const issueDate = todayIso(at(job, 'drafted'));
      await Quote.update(
        {
          status: wanted.quote,
          linkNonce: newLinkNonce(),
          sentAt: at(job, 'sent'),
          issueDate,
          validUntil: shiftIso(draft.validUntil, draft.issueDate, issueDate),
          ...(wanted.quote === 'accepted' ? { acceptedAt: at(job, 'answered'), acceptedName: customer?.name ?? 'The customer' } : {}),
          ...(wanted.quote === 'declined' ? { declinedAt: at(job, 'answered'), declineReason: 'We have decided to wait until spring.' } : {}),
        },
        { where: { id: draft.id } },
      );
      if (wanted.invoice) quoted.push(job);
    }
    for (const job of quoted.sort(inOrderOf('invoiced'))) {
      const invoice = await invoices.create(actor, { jobId: job.id, variations: [], notes: '', send: false });
      const issueDate = todayIso(at(job, 'invoiced'));
      await Invoice.update(
        { status: 'paid', paidAt: at(job, 'paid'), issueDate, dueDate: invoice.dueDate && shiftIso(invoice.dueDate, invoice.issueDate, issueDate) },
        { where: { id: invoice.id } },
      );
    }
  }
}
