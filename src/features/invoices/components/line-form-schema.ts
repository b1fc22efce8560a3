import { z } from 'zod';
import { invoiceLineInputSchema } from '../../../../shared/api/invoices';
import { taxClassSchema, type TaxClass } from '../../../../shared/api/settings';
import { moneyText, numberText } from '../../../lib/forms';

/** A line as typed: quantity and price stay text until checked, so "12." does not jump while typing. */
export interface LineValues {
  description: string;
  quantity: string;
  unitPriceMinor: string;
  taxClass: TaxClass;
}

export const emptyLine = (): LineValues => ({ description: '', quantity: '1', unitPriceMinor: '', taxClass: 'standard' });

/** True for a row with neither a description nor a price: it is left out, as if never added. */
export const isBlankLine = (l: LineValues) => !l.description.trim() && !l.unitPriceMinor.trim();

/** The index of each row that is sent, in order: the server's `variations.N` is row `keptRows(…)[N]`. */
export const keptRows = (lines: readonly LineValues[]) => lines.flatMap((l, i) => (isBlankLine(l) ? [] : [i]));

/**
 * Typed lines → the API's lines (invoiceLineInputSchema, prices in minor units through readMoney).
 * Blank rows are dropped after the check, so each message keeps the path of its own row
 * ("variations.1.unitPriceMinor"), the same path the server's 422 would name.
 */
export function linesFormSchema(currency: string) {
  const api = invoiceLineInputSchema.shape;
  const line = invoiceLineInputSchema.extend({
    quantity: numberText(api.quantity, { blank: 'missing' }),
    unitPriceMinor: moneyText(api.unitPriceMinor, currency),
  });
  const row = z.object({ description: z.string(), quantity: z.string(), unitPriceMinor: z.string(), taxClass: taxClassSchema }).transform((l, ctx) => {
    if (isBlankLine(l)) return null;
    const r = line.safeParse(l);
    if (r.success) return r.data;
    for (const issue of r.error.issues) ctx.addIssue({ code: 'custom', message: issue.message, path: issue.path });
    return z.NEVER;
  });
  return z.array(row).transform((rows) => rows.filter((r) => r !== null));
}
