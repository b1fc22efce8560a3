import type { Job } from '../../db/models';
import type { Quote } from '../../db/models/quote';
import type { QuoteLine } from '../../db/models/quote-line';
import type { CompanySetting } from '../../db/models/company-setting';
import { StorageNotFoundError, type Storage } from '../../lib/storage';
import { renderQuotePdf, type QuotePdfData } from '../../lib/pdf/quote-pdf';
import { depositTerms } from '../../../shared/quote/deposit';
import { loadPaymentSettings } from '../settings/payment-settings';
import { priceQuote } from './quote-dto';

export function addressLines(a: { line1: string; line2?: string; town: string; postcode: string }): string[] {
  return [a.line1, a.line2 ?? '', a.town, a.postcode].filter((l) => l && l.trim());
}

/** Everything the customer's PDF prints, from the stored quote (the snapshot's tax rates, never today's). */
export async function quotePdfData(
  q: Quote,
  lines: QuoteLine[],
  job: Job,
  settings: CompanySetting,
  storage: Storage,
  acceptUrl: string | null,
): Promise<QuotePdfData> {
  const { snap, totals, saving } = priceQuote(q, lines);
  // A logo whose file has gone (removed by hand from the folder or bucket) leaves the quote without one.
  const logo = settings.logoKey ? await storage.read(settings.logoKey).catch((e) => (e instanceof StorageNotFoundError ? null : Promise.reject(e))) : null;
  const customer = job.customer!;
  return {
    company: {
      name: settings.companyName,
      addressLines: addressLines(settings.address),
      email: settings.email,
      phone: settings.phone,
      taxNumber: settings.taxNumber,
      logo,
    },
    customer: { name: customer.name, email: customer.email, phone: customer.phone },
    propertyAddressLines: addressLines({ line1: job.addressLine1, line2: job.addressLine2, town: job.town, postcode: job.postcode }),
    quote: {
      number: q.number,
      version: q.version,
      issueDate: q.issueDate,
      validUntil: q.validUntil,
      currency: q.currency,
      locale: q.locale,
      jobReference: job.reference,
    },
    lines: totals.lines.map((p) => ({
      description: p.line.description,
      quantity: p.line.quantity,
      unit: p.line.unit,
      unitPriceMinor: p.line.unitPriceMinor,
      netMinor: p.netMinor,
      rateBp: p.rateBp,
      note: p.line.note,
    })),
    totals: { netMinor: totals.netMinor, taxByRate: totals.taxByRate, taxMinor: totals.taxMinor, grossMinor: totals.grossMinor },
    deposit: depositTerms(totals.grossMinor, await loadPaymentSettings(q.organisationId)),
    saving,
    spaces: snap.spaces,
    siteHours: snap.siteHours,
    crewSize: snap.crewSize,
    cautions: snap.cautions,
    customerBeforeInstall: snap.customerBeforeInstall,
    terms: settings.terms,
    acceptUrl,
    notes: q.notes,
  };
}

export async function quotePdf(q: Quote, lines: QuoteLine[], job: Job, settings: CompanySetting, storage: Storage, acceptUrl: string | null): Promise<Buffer> {
  return renderQuotePdf(await quotePdfData(q, lines, job, settings, storage, acceptUrl));
}

export function quoteFileName(q: Quote, ext: string): string {
  return `quote-${q.number}${q.version > 1 ? `-v${q.version}` : ''}.${ext}`;
}
