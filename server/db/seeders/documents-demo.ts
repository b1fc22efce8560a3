import type { JobStage } from '../../../shared/api/jobs';
import { addDaysIso, todayIso } from '../../../shared/dates';
import type { AppDeps } from '../../deps';
import { createInvoicesService } from '../../modules/invoices/invoices.service';
import { createPaymentsService } from '../../modules/payments/payments.service';
import { newLinkNonce } from '../../modules/quotes/quote-link';
import { createQuotesService } from '../../modules/quotes/quotes.service';
import type { SessionUser } from '../../types';
import { Customer, Invoice, Job, Organisation, Quote, User } from '../models';

/** What a job at each stage has been sent and answered: the quote's state, and whether it is invoiced and paid. */
const DOCUMENTS_BY_STAGE: Partial<Record<JobStage, { quote: 'sent' | 'declined' | 'accepted'; invoice?: 'paid' }>> = {
  quoted: { quote: 'sent' },
  declined: { quote: 'declined' },
  accepted: { quote: 'accepted' },
  scheduled: { quote: 'accepted' },
  installed: { quote: 'accepted' },
  closed: { quote: 'accepted', invoice: 'paid' },
};

/**
 * Gives every demo job past the survey the quote (and, once closed, the paid invoice) its stage
 * implies, drafted from its stored takeoff by the quotes service like any other; a job already
 * holding a quote is left alone, so this is idempotent. An installed job is left to invoice.
 */
export async function seedDemoDocuments(deps: AppDeps, organisationNames: string[]): Promise<void> {
  const quotes = createQuotesService(deps);
  const invoices = createInvoicesService(deps, createPaymentsService(deps));
  for (const name of organisationNames) {
    const org = await Organisation.findOne({ where: { name } });
    const office = org && (await User.findOne({ where: { organisationId: org.id, role: 'office', active: true } }));
    if (!org || !office) continue;
    const actor: SessionUser = { id: office.id, email: office.email, name: office.name, role: 'office', organisationId: org.id, organisationName: org.name };
    for (const job of await Job.findAll({ where: { organisationId: org.id }, order: [['reference', 'ASC']] })) {
      const wanted = DOCUMENTS_BY_STAGE[job.stage];
      if (!wanted || (await Quote.count({ where: { jobId: job.id } })) > 0) continue;
      const customer = await Customer.findByPk(job.customerId);
      const draft = await quotes.createFromJob(actor, job.id, {});
      const sentAt = new Date(Date.now() - 10 * 86_400_000);
      await Quote.update(
        {
          status: wanted.quote,
          linkNonce: newLinkNonce(),
          sentAt,
          issueDate: addDaysIso(todayIso(), -10),
          ...(wanted.quote === 'accepted' ? { acceptedAt: new Date(sentAt.getTime() + 2 * 86_400_000), acceptedName: customer?.name ?? 'The customer' } : {}),
          ...(wanted.quote === 'declined'
            ? { declinedAt: new Date(sentAt.getTime() + 3 * 86_400_000), declineReason: 'We have decided to wait until spring.' }
            : {}),
        },
        { where: { id: draft.id } },
      );
      if (wanted.invoice) {
        const invoice = await invoices.create(actor, { jobId: job.id, variations: [], notes: '', send: false });
        await Invoice.update({ status: 'paid', paidAt: new Date() }, { where: { id: invoice.id } });
      }
    }
  }
}
