/**
 * Money in integer minor units (pence, cents). Every amount a quote stores or adds is an integer;
 * only the multiplication of a price by a decimal quantity or a rate rounds, once, half-up
 * (half away from zero), in integer arithmetic so no binary-float drift creeps in.
 */

/** Quantities are kept to three decimals (0.001 of a unit: a millimetre of lagging, 3.6 s of labour). */
export const QUANTITY_SCALE = 1000;

/** `numerator / denominator` rounded half away from zero, on BigInt; denominator > 0. */
function divRoundHalfUp(numerator: bigint, denominator: bigint): bigint {
  const negative = numerator < 0n;
  const abs = negative ? -numerator : numerator;
  const q = (abs * 2n + denominator) / (denominator * 2n);
  return negative ? -q : q;
}

/** A decimal quantity as an integer count of thousandths; throws on NaN/Infinity. */
export function quantityToMilli(quantity: number): number {
  if (!Number.isFinite(quantity)) throw new RangeError(`quantity must be a finite number, got ${quantity}`);
  // toFixed rounds the binary value's decimal expansion, so 1.0005 (really 1.000499…) gives 1000 or 1001 consistently with its printed form.
  return Math.round(Number((quantity * QUANTITY_SCALE).toFixed(6)));
}

/** Checks that a value is a safe integer amount of minor units. */
export function assertMinor(value: number, what = 'amount'): number {
  if (!Number.isSafeInteger(value)) throw new RangeError(`${what} must be a whole number of minor units, got ${value}`);
  return value;
}

/**
 * quantity × unit price, in minor units, rounded half-up once.
 * E.g. 2.345 m × 199 p = 466.655 p → 467 p.
 */
export function multiplyMinor(quantity: number, unitPriceMinor: number): number {
  assertMinor(unitPriceMinor, 'unit price');
  const milli = BigInt(quantityToMilli(quantity));
  return Number(divRoundHalfUp(milli * BigInt(unitPriceMinor), BigInt(QUANTITY_SCALE)));
}

/**
 * A rate in basis points (2000 = 20%) of an amount, rounded half-up once.
 * E.g. 20% of 1,234 p = 246.8 → 247 p; 5% of 1,010 p = 50.5 → 51 p.
 */
export function applyRateBp(amountMinor: number, rateBp: number): number {
  assertMinor(amountMinor);
  if (!Number.isInteger(rateBp) || rateBp < 0) throw new RangeError(`rate must be whole basis points ≥ 0, got ${rateBp}`);
  return Number(divRoundHalfUp(BigInt(amountMinor) * BigInt(rateBp), 10_000n));
}

/** Sum of minor-unit amounts (all integers, so exact). */
export function sumMinor(values: readonly number[]): number {
  let total = 0;
  for (const v of values) total += assertMinor(v);
  return assertMinor(total, 'total');
}

const digitsCache = new Map<string, number>();
/** Minor-unit digits of a currency (GBP 2, JPY 0, KWD 3), from Intl. Throws on an unknown code. */
export function currencyDigits(currency: string): number {
  let d = digitsCache.get(currency);
  if (d === undefined) {
    d = new Intl.NumberFormat('en', { style: 'currency', currency }).resolvedOptions().maximumFractionDigits ?? 2;
    digitsCache.set(currency, d);
  }
  return d;
}

/** Formats minor units for people, e.g. (123456, 'GBP', 'en-GB') → "£1,234.56". */
export function formatMoney(minor: number, currency: string, locale = 'en-GB'): string {
  const digits = currencyDigits(currency);
  const major = minor / 10 ** digits; // display only: Intl rounds to `digits`, which is exact here
  return new Intl.NumberFormat(locale, {
    style: 'currency',
    currency,
    minimumFractionDigits: digits,
    maximumFractionDigits: digits,
  }).format(major);
}

/** Minor units as a plain decimal string for spreadsheets and CSV, e.g. 123456 GBP → "1234.56". */
export function minorToDecimalString(minor: number, currency: string): string {
  const digits = currencyDigits(currency);
  assertMinor(minor);
  const negative = minor < 0;
  const s = String(Math.abs(minor)).padStart(digits + 1, '0');
  const body = digits === 0 ? s : `${s.slice(0, -digits)}.${s.slice(-digits)}`;
  return negative ? `-${body}` : body;
}
