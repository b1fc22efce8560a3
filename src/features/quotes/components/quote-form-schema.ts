import { z } from 'zod';
import { quoteLineBodySchema, quotePatchSchema, type Quote } from '../../../../shared/api/quotes';
import type { TaxClass } from '../../../../shared/api/settings';
import { formatMoneyInput, readMoney } from '../../../../shared/quote/money-input';
import type { LineKind } from '../../../../shared/quote/totals';
import { moneyText, numberText } from '../../../lib/forms';

/**
 * A quote line as typed: quantity, unit and price stay text until checked, so "12." does not jump
 * while typing. The rest (kind, cost, product, the takeoff's note) rides along unchanged.
 */
export interface QuoteLineValues {
  kind: LineKind;
  description: string;
  quantity: string;
  unit: string;
  unitPriceMinor: string;
  unitCostMinor: number;
  taxClass: TaxClass;
  productId: string | null;
  extraKind: string | null;
  altQuantity: number | null;
  note: string;
}

export interface QuoteFormValues {
  lines: QuoteLineValues[];
  validUntil: string;
  notes: string;
}

export const blankLine = (currency: string, locale: string): QuoteLineValues => ({
  kind: 'custom',
  description: '',
  quantity: '1',
  unit: 'each',
  unitPriceMinor: formatMoneyInput(0, currency, locale),
  unitCostMinor: 0,
  taxClass: 'standard',
  productId: null,
  extraKind: null,
  altQuantity: null,
  note: '',
});

/**
 * True for a row with no description and no price (blank, or the 0.00 a new row starts with): it is
 * left out, as if never added. A row with a price but no description is asked to describe it.
 */
export function isBlankLine(l: QuoteLineValues, currency: string, locale: string): boolean {
  if (l.description.trim()) return false;
  if (!l.unitPriceMinor.trim()) return true;
  const price = readMoney(l.unitPriceMinor, currency, locale);
  return price.ok && price.minor === 0;
}

/** The index of each row that is sent, in order: the server's `lines.N` is row `keptRows(…)[N]`. */
export function keptRows(lines: readonly QuoteLineValues[], currency: string, locale: string): number[] {
  return lines.flatMap((l, i) => (isBlankLine(l, currency, locale) ? [] : [i]));
}

/** The stored quote as the form's values (prices written back in the company's locale). */
export function quoteFormValues(q: Quote): QuoteFormValues {
  return {
    lines: q.lines.map((l) => ({
      kind: l.kind,
      description: l.description,
      quantity: String(l.quantity),
      unit: l.unit,
      unitPriceMinor: formatMoneyInput(l.unitPriceMinor, q.currency, q.locale),
      unitCostMinor: l.unitCostMinor,
      taxClass: l.taxClass,
      productId: l.productId ?? null,
      extraKind: l.extraKind ?? null,
      altQuantity: l.altQuantity ?? null,
      note: l.note ?? '',
    })),
    validUntil: q.validUntil,
    notes: q.notes,
  };
}

/**
 * Typed lines → the PATCH the server validates (quotePatchSchema, each line quoteLineBodySchema):
 * quantity read as a number, price through readMoney in minor units, a blank unit as the API's
 * default. Blank rows are dropped after the check, so each message keeps the path of its own row
 * ("lines.2.unitPriceMinor"); the kept lines then pass the API's own array rule (at most 200).
 */
export function quoteFormSchema(currency: string, locale: string) {
  const api = quoteLineBodySchema.shape;
  const line = quoteLineBodySchema.extend({
    quantity: numberText(api.quantity, { blank: 'missing' }),
    unit: z
      .string()
      .transform((text) => text.trim() || undefined)
      .pipe(api.unit),
    unitPriceMinor: moneyText(api.unitPriceMinor, currency, locale),
  });
  const row = z.custom<QuoteLineValues>().transform((l, ctx) => {
    if (isBlankLine(l, currency, locale)) return null;
    const r = line.safeParse(l);
    if (r.success) return r.data;
    for (const issue of r.error.issues) ctx.addIssue({ code: 'custom', message: issue.message, path: issue.path });
    return z.NEVER;
  });
  const apiLines = quotePatchSchema.shape.lines.unwrap();
  return quotePatchSchema.extend({
    lines: z
      .array(row)
      .transform((rows) => rows.filter((r) => r !== null))
      .pipe(apiLines as unknown as z.ZodType<z.output<typeof apiLines>, z.output<typeof line>[]>),
  });
}
export type QuoteFormSchema = ReturnType<typeof quoteFormSchema>;
