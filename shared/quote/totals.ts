import type { TaxClass } from '../api/settings';
import { applyRateBp, multiplyMinor, sumMinor } from './money';
import { taxRateOn, type DatedTaxRate } from './tax';

/** What a quote line is, for grouping and for the labour/extras rules. */
export const LINE_KINDS = ['material', 'extra', 'labour', 'charge', 'custom'] as const;
export type LineKind = (typeof LINE_KINDS)[number];

/** One priced line of a quote, as stored and edited. Money in minor units; quantity to 3 decimals. */
export interface QuoteLineInput {
  kind: LineKind;
  description: string;
  quantity: number;
  unit: string;
  unitPriceMinor: number;
  /** What the line costs the company per unit, for the margin. */
  unitCostMinor: number;
  taxClass: TaxClass;
  productId?: string | null;
  extraKind?: string | null;
  /** The other roll count beside a material line (the rule of thumb when priced by packing). */
  altQuantity?: number | null;
  note?: string;
}

export interface PricedLine<L extends QuoteLineInput = QuoteLineInput> {
  line: L;
  netMinor: number;
  costMinor: number;
  rateBp: number;
  taxMinor: number;
}

export interface TaxBucket {
  rateBp: number;
  netMinor: number;
  taxMinor: number;
}

export interface QuoteTotals<L extends QuoteLineInput = QuoteLineInput> {
  lines: PricedLine<L>[];
  netMinor: number;
  /** Tax grouped by rate, highest rate first; each bucket is the sum of its lines' rounded tax. */
  taxByRate: TaxBucket[];
  taxMinor: number;
  grossMinor: number;
  costMinor: number;
  /** Net minus cost. */
  marginMinor: number;
  /** Margin as basis points of the net (0 when the net is 0). */
  marginBp: number;
}

/**
 * Net and tax summed per tax rate (basis points), highest rate first. Each bucket adds the lines'
 * already-rounded minor units, so it is exact; used by quotes and invoices alike.
 */
export function groupTaxByRate(lines: readonly { rateBp: number; netMinor: number; taxMinor: number }[]): TaxBucket[] {
  const buckets = new Map<number, TaxBucket>();
  for (const l of lines) {
    const b = buckets.get(l.rateBp) ?? { rateBp: l.rateBp, netMinor: 0, taxMinor: 0 };
    b.netMinor += l.netMinor;
    b.taxMinor += l.taxMinor;
    buckets.set(l.rateBp, b);
  }
  return [...buckets.values()].sort((a, b) => b.rateBp - a.rateBp);
}

/** The rounding rule, in words for the quote and the PDF. */
export const ROUNDING_NOTE = 'Each line is rounded to the penny (half up), and so is the tax on each line; totals are the sums of the rounded lines.';

/**
 * Prices a quote's lines: per line net = quantity × unit price, tax = net × the class's rate on
 * `taxDateIso` — each rounded half-up once, per line — then totals as exact integer sums.
 * Throws when a line's class has no rate on that date.
 */
export function computeQuoteTotals<L extends QuoteLineInput>(lines: readonly L[], rates: readonly DatedTaxRate[], taxDateIso: string): QuoteTotals<L> {
  const priced = lines.map((line) => {
    const netMinor = multiplyMinor(line.quantity, line.unitPriceMinor);
    const costMinor = multiplyMinor(line.quantity, line.unitCostMinor);
    const rateBp = taxRateOn(rates, line.taxClass, taxDateIso).rateBp;
    return { line, netMinor, costMinor, rateBp, taxMinor: applyRateBp(netMinor, rateBp) };
  });
  const netMinor = sumMinor(priced.map((p) => p.netMinor));
  const taxMinor = sumMinor(priced.map((p) => p.taxMinor));
  const costMinor = sumMinor(priced.map((p) => p.costMinor));
  const marginMinor = netMinor - costMinor;
  return {
    lines: priced,
    netMinor,
    taxByRate: groupTaxByRate(priced),
    taxMinor,
    grossMinor: netMinor + taxMinor,
    costMinor,
    marginMinor,
    marginBp: netMinor === 0 ? 0 : Math.round((marginMinor * 10_000) / netMinor),
  };
}
