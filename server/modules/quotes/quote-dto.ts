import type { Quote as QuoteDto, QuoteLineBody } from '../../../shared/api/quotes';
import { computeQuoteTotals, type QuoteLineInput } from '../../../shared/quote/totals';
import { paybackYears } from '../../../shared/takeoff/savings';
import type { DatedTaxRate } from '../../../shared/quote/tax';
import type { Quote } from '../../db/models/quote';
import type { QuoteLine } from '../../db/models/quote-line';

/** What a quote keeps from the time it was built (never recomputed once sent). */
export interface QuoteSnapshot {
  spaces: Array<{
    id: string;
    name: string;
    revision: number | null;
    plan: unknown;
    netAreaM2: number | null;
    uBefore: number | null;
    uAfter: number | null;
    /** U-values named for the PDF (quotes built before it was kept have none). */
    thermalText?: string;
    layers: string[];
    takeoffLayers?: Array<{ role: string; productName: string; areaM2: number; rollsByPacking: number; rollsByArea: number }>;
  }>;
  saving: { kwhPerYear: number; minorPerYear: number } | null;
  personHours: number;
  siteHours: number;
  crewSize: number;
  warnings: string[];
  cautions: string[];
  customerBeforeInstall: string[];
  taxRates: DatedTaxRate[];
}

export function snapshotOf(q: Quote): QuoteSnapshot {
  const s = (q.snapshot ?? {}) as Partial<QuoteSnapshot>;
  return {
    spaces: s.spaces ?? [],
    saving: s.saving ?? null,
    personHours: s.personHours ?? 0,
    siteHours: s.siteHours ?? 0,
    crewSize: s.crewSize ?? 1,
    warnings: s.warnings ?? [],
    cautions: s.cautions ?? [],
    customerBeforeInstall: s.customerBeforeInstall ?? [],
    taxRates: s.taxRates ?? [],
  };
}

export function lineInput(l: QuoteLine): QuoteLineInput & { id: string; position: number } {
  return {
    id: l.id,
    position: l.position,
    kind: l.kind,
    description: l.description,
    quantity: Number(l.quantity),
    unit: l.unit,
    unitPriceMinor: Number(l.unitPriceMinor),
    unitCostMinor: Number(l.unitCostMinor),
    taxClass: l.taxClass,
    productId: l.productId,
    extraKind: l.extraKind,
    altQuantity: l.altQuantity === null ? null : Number(l.altQuantity),
    note: l.note,
  };
}

/** Line rows for insert, from API bodies or built lines. */
export function lineRows(organisationId: string, quoteId: string, lines: ReadonlyArray<QuoteLineInput | QuoteLineBody>) {
  return lines.map((l, i) => ({
    organisationId,
    quoteId,
    position: i + 1,
    kind: l.kind ?? 'custom',
    description: l.description,
    quantity: l.quantity,
    unit: l.unit ?? 'each',
    unitPriceMinor: l.unitPriceMinor,
    unitCostMinor: l.unitCostMinor ?? 0,
    taxClass: l.taxClass,
    productId: l.productId ?? null,
    extraKind: l.extraKind ?? null,
    altQuantity: l.altQuantity ?? null,
    note: l.note ?? '',
  }));
}

/** Prices a stored quote with its snapshot's tax rates on its issue date. */
export function priceQuote(q: Quote, lines: QuoteLine[]) {
  const snap = snapshotOf(q);
  const inputs = [...lines].sort((a, b) => a.position - b.position).map(lineInput);
  const totals = computeQuoteTotals(inputs, snap.taxRates, q.issueDate);
  const saving = snap.saving
    ? { kwhPerYear: snap.saving.kwhPerYear, minorPerYear: snap.saving.minorPerYear, paybackYears: paybackYears(totals.grossMinor, snap.saving.minorPerYear) }
    : null;
  return { snap, totals, saving };
}

export function toQuoteDto(q: Quote, lines: QuoteLine[], versions: Array<{ id: string; version: number; status: Quote['status'] }>): Omit<QuoteDto, 'deposit'> {
  const { snap, totals, saving } = priceQuote(q, lines);
  return {
    id: q.id,
    jobId: q.jobId,
    number: q.number,
    version: q.version,
    status: q.status,
    currency: q.currency,
    locale: q.locale,
    issueDate: q.issueDate,
    validUntil: q.validUntil,
    lines: totals.lines.map((p) => {
      const l = p.line;
      return {
        id: l.id,
        position: l.position,
        kind: l.kind,
        description: l.description,
        quantity: l.quantity,
        unit: l.unit,
        unitPriceMinor: l.unitPriceMinor,
        unitCostMinor: l.unitCostMinor,
        taxClass: l.taxClass,
        productId: l.productId ?? null,
        extraKind: l.extraKind ?? null,
        altQuantity: l.altQuantity ?? null,
        note: l.note ?? '',
        netMinor: p.netMinor,
        costMinor: p.costMinor,
        rateBp: p.rateBp,
        taxMinor: p.taxMinor,
      };
    }),
    totals: {
      netMinor: totals.netMinor,
      taxByRate: totals.taxByRate,
      taxMinor: totals.taxMinor,
      grossMinor: totals.grossMinor,
      costMinor: totals.costMinor,
      marginMinor: totals.marginMinor,
      marginBp: totals.marginBp,
    },
    saving,
    taxRates: snap.taxRates,
    personHours: snap.personHours,
    siteHours: snap.siteHours,
    warnings: snap.warnings,
    cautions: snap.cautions,
    customerBeforeInstall: snap.customerBeforeInstall,
    notes: q.notes,
    sentAt: q.sentAt ? q.sentAt.toISOString() : null,
    acceptedAt: q.acceptedAt ? q.acceptedAt.toISOString() : null,
    acceptedName: q.acceptedName ?? null,
    declinedAt: q.declinedAt ? q.declinedAt.toISOString() : null,
    declineReason: q.declineReason ?? null,
    versions,
    createdAt: q.createdAt.toISOString(),
    updatedAt: q.updatedAt.toISOString(),
  };
}
