import type { Quote, QuoteLineBody } from '../../../../shared/api/quotes';
import type { TaxClass } from '../../../../shared/api/settings';
import { formatMoneyInput, readMoney } from '../../../../shared/quote/money-input';
import type { QuoteLineInput } from '../../../../shared/quote/totals';

/** A line as typed in the builder: numbers kept as the text the user typed until saved. */
export interface DraftLine {
  key: string;
  kind: QuoteLineInput['kind'];
  description: string;
  quantityText: string;
  unit: string;
  priceText: string;
  unitCostMinor: number;
  taxClass: TaxClass;
  productId: string | null;
  extraKind: string | null;
  altQuantity: number | null;
  note: string;
}

let seq = 0;
export const newKey = () => `l${++seq}`;

export function toDraft(q: Quote): DraftLine[] {
  return q.lines.map((l) => ({
    key: newKey(),
    kind: l.kind,
    description: l.description,
    quantityText: String(l.quantity),
    unit: l.unit,
    priceText: formatMoneyInput(l.unitPriceMinor, q.currency, q.locale),
    unitCostMinor: l.unitCostMinor,
    taxClass: l.taxClass,
    productId: l.productId ?? null,
    extraKind: l.extraKind ?? null,
    altQuantity: l.altQuantity ?? null,
    note: l.note ?? '',
  }));
}

export function blankLine(currency = 'GBP', locale = 'en-GB'): DraftLine {
  return {
    key: newKey(),
    kind: 'custom',
    description: '',
    quantityText: '1',
    unit: 'each',
    priceText: formatMoneyInput(0, currency, locale),
    unitCostMinor: 0,
    taxClass: 'standard',
    productId: null,
    extraKind: null,
    altQuantity: null,
    note: '',
  };
}

export type LineProblem = { key: string; field: 'quantity' | 'price' | 'description'; message: string };

/** Parses typed lines; problems name the line and field, lines are ready for the API and for pricing. */
export function parseDraft(
  lines: DraftLine[],
  currency: string,
  locale = 'en-GB',
): { body: QuoteLineBody[]; inputs: QuoteLineInput[]; problems: LineProblem[] } {
  const problems: LineProblem[] = [];
  const body: QuoteLineBody[] = [];
  for (const l of lines) {
    const quantity = Number(l.quantityText.trim());
    const price = readMoney(l.priceText, currency, locale);
    if (!l.description.trim()) problems.push({ key: l.key, field: 'description', message: 'describe the line' });
    if (l.quantityText.trim() === '' || !Number.isFinite(quantity) || quantity < 0)
      problems.push({ key: l.key, field: 'quantity', message: 'enter a quantity of 0 or more' });
    else if (Math.abs(quantity * 1000 - Math.round(quantity * 1000)) > 1e-6)
      problems.push({ key: l.key, field: 'quantity', message: 'use at most three decimals' });
    if (!price.ok) problems.push({ key: l.key, field: 'price', message: price.message });
    body.push({
      kind: l.kind,
      description: l.description.trim(),
      quantity: Number.isFinite(quantity) ? quantity : 0,
      unit: l.unit || 'each',
      unitPriceMinor: price.ok ? price.minor : 0,
      unitCostMinor: l.unitCostMinor,
      taxClass: l.taxClass,
      productId: l.productId,
      extraKind: l.extraKind,
      altQuantity: l.altQuantity,
      note: l.note,
    });
  }
  const inputs = body.map((b) => ({ ...b, kind: b.kind ?? 'custom', unit: b.unit ?? 'each', unitCostMinor: b.unitCostMinor ?? 0, note: b.note ?? '' }));
  return { body, inputs, problems };
}
