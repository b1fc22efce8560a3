import { z } from 'zod';
import { readMoney } from '../../../shared/quote/money-input';

/**
 * A money field as typed ("£1,234.50") read by the one money parser into minor units, then checked
 * by the API's own rule for that field: `moneyText(api.shape.unitPriceMinor, 'GBP')`. Text it cannot
 * read without guessing is refused with readMoney's sentence, on this field.
 */
export function moneyText<T extends z.ZodType>(api: T, currency: string, locale = 'en-GB') {
  return z
    .string()
    .transform((text, ctx) => {
      const r = readMoney(text, currency, locale);
      if (r.ok) return r.minor;
      ctx.addIssue({ code: 'custom', message: r.message });
      return z.NEVER;
    })
    .pipe(api as unknown as z.ZodType<z.output<T>, number>);
}

/**
 * A number typed as text, then the API's rule. Blank is `undefined` (the API's default applies), or
 * with `blank: 'missing'` not a number, so the API's "enter …" names the field.
 */
export function numberText<T extends z.ZodType>(api: T, opts: { blank?: 'default' | 'missing' } = {}) {
  return z
    .string()
    .transform((text) => (text.trim() === '' ? (opts.blank === 'missing' ? Number.NaN : undefined) : Number(text)))
    .pipe(api as unknown as z.ZodType<z.output<T>, number | undefined>);
}

/** A percentage typed as text ("7.5") as the API's number: 100 for a fraction (0.075), 10000 for basis points (750). */
export function percentText<T extends z.ZodType>(api: T, per: 'fraction' | 'basis-points') {
  return z
    .string()
    .transform((text) => {
      if (text.trim() === '') return undefined;
      const n = Number(text);
      return per === 'fraction' ? n / 100 : Math.round(n * 100);
    })
    .pipe(api as unknown as z.ZodType<z.output<T>, number | undefined>);
}

/** A yes/no select ("true" / "false") as the API's boolean. */
export const booleanText = z.enum(['true', 'false']).transform((v) => v === 'true');

/** Text with the spaces around it dropped before the API's rule (an e-mail address pasted with a trailing space). */
export function trimmedText<T extends z.ZodType>(api: T) {
  return z
    .string()
    .transform((text) => text.trim())
    .pipe(api as unknown as z.ZodType<z.output<T>, string>);
}
