import type { DepositStatus } from '../../../shared/api/payments';
import type { Invoice as InvoiceDto } from '../../../shared/api/invoices';
import type { AppDeps } from '../../deps';
import { CompanySetting } from '../../db/models/company-setting';
import { Invoice } from '../../db/models/invoice';
import type { Payment } from '../../db/models/payment';
import { Quote } from '../../db/models/quote';
import { AppError, NotFoundError } from '../../lib/errors';
import type { InvoicesService } from '../invoices/invoices.service';
import { linkSecret } from '../quotes/quote-send.service';
import { paymentsContext } from './payments-context';
import type { PaymentsService } from './payments.service';
import { quoteFromLink } from './quote-link-resolver';

/** A link that names nothing is null (the page says so); any other failure (the database away) is thrown. */
function onlyNotFound(e: unknown): null {
  if (e instanceof NotFoundError) return null;
  throw e;
}

/**
 * What the customer's /pay pages show and start, found by their private links (no sign-in).
 * Every lookup answers null for a link that names nothing; starting a checkout answers the hosted
 * checkout's url, or null when nothing is left to pay.
 */
export function createPayService(deps: AppDeps, payments: PaymentsService, invoices: InvoicesService) {
  const ctx = paymentsContext(deps);
  const companyName = async (organisationId: string) => (await CompanySetting.findByPk(organisationId))?.companyName ?? '';
  const invoiceFromToken = (token: string) => invoices.byPayToken(token).catch(onlyNotFound);
  const paymentFromToken = (token: string) => payments.paymentByToken(token).catch(onlyNotFound);

  return {
    /** Origins the hosted checkout lives on, for the pages' form-action CSP. */
    checkoutOrigins: ctx.checkoutOrigins,
    /** False when card payments are switched off: the pages say how else to pay. */
    cardPayments: ctx.gateway !== null,

    async deposit(link: string): Promise<{ quote: Quote; status: DepositStatus; company: string } | null> {
      const quote = await quoteFromLink(link, linkSecret(deps));
      if (!quote) return null;
      const company = await companyName(quote.organisationId);
      return { quote, company, status: await payments.depositStatusOf(quote) };
    },

    async startDeposit(link: string): Promise<{ url: string | null } | null> {
      const quote = await quoteFromLink(link, linkSecret(deps));
      if (!quote) return null;
      return { url: await payments.startDeposit(quote) };
    },

    async invoice(token: string): Promise<{ invoice: InvoiceDto; company: string } | null> {
      const inv = await invoiceFromToken(token);
      if (!inv) return null;
      const invoice = await invoices.dto(inv);
      return { invoice, company: await companyName(inv.organisationId) };
    },

    async startInvoice(token: string): Promise<{ url: string | null } | null> {
      try {
        return { url: await invoices.startPayByToken(token) };
      } catch (e) {
        if (e instanceof AppError && e.status === 404) return null;
        throw e;
      }
    },

    async invoicePdf(token: string) {
      const inv = await invoiceFromToken(token);
      return inv ? invoices.pdfOf(inv) : null;
    },

    async payment(token: string): Promise<{ payment: Payment; company: string } | null> {
      const payment = await paymentFromToken(token);
      if (!payment) return null;
      return { payment, company: await companyName(payment.organisationId) };
    },

    /** A new checkout for what an earlier one was for (after a cancel); its url, or null when nothing is due. */
    async retry(token: string): Promise<{ payment: Payment; url: string | null } | null> {
      const p = await paymentFromToken(token);
      if (!p) return null;
      let url: string | null = null;
      if (p.purpose === 'deposit' && p.quoteId) {
        const quote = await Quote.findByPk(p.quoteId);
        if (quote) url = await payments.startDeposit(quote);
      } else if (p.invoiceId) {
        const inv = await Invoice.findByPk(p.invoiceId);
        if (inv?.payToken) url = await invoices.startPayByToken(inv.payToken);
      }
      return { payment: p, url };
    },
  };
}

export type PayService = ReturnType<typeof createPayService>;
