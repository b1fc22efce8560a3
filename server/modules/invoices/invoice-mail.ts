import { formatMoney } from '../../../shared/quote/money';
import { formatDate } from '../../../shared/dates';
import type { AppDeps } from '../../deps';
import type { Invoice } from '../../db/models/invoice';
import { sendCompanyMail } from '../mail/mail.service';
import type { InvoiceDocuments } from './invoice-documents';
import { renderInvoicePdf } from './invoice-pdf';

/**
 * Mails an invoice or credit note with its PDF to the customer and marks it sent; false (and nothing
 * sent) when the customer has no e-mail address.
 */
export function createInvoiceMailer(deps: AppDeps, docs: Pick<InvoiceDocuments, 'dto' | 'companyDetails'>) {
  const { dto, companyDetails } = docs;
  return async function mailDocument(inv: Invoice): Promise<boolean> {
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
  };
}
