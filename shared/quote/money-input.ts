import { currencyDigits } from './money';

/** What reading a typed amount gave: minor units, or a sentence saying what to type instead. */
export type MoneyReading = { ok: true; minor: number } | { ok: false; message: string };

type Separators = { decimal: string; group: string };
const separatorsCache = new Map<string, Separators>();

/** The decimal and grouping marks people type in `locale` ("en-GB" → "." and ","; "de-DE" → "," and "."), from Intl. */
function separatorsOf(locale: string): Separators {
  let s = separatorsCache.get(locale);
  if (!s) {
    const parts = new Intl.NumberFormat(locale, { useGrouping: true }).formatToParts(12345.6);
    s = { decimal: parts.find((p) => p.type === 'decimal')?.value ?? '.', group: parts.find((p) => p.type === 'group')?.value ?? ',' };
    separatorsCache.set(locale, s);
  }
  return s;
}

const escape = (c: string) => c.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
// Spaces of every kind count as grouping in locales that group with a (narrow) no-break space.
const isSpace = (c: string) => /\s/u.test(c);

/**
 * Reads an amount typed by a person in `locale` into minor units of `currency`.
 *
 * Accepts a sign, a currency symbol or code, the locale's grouping marks every three digits and its
 * decimal mark ("£1,234.50", "1234.5", "-12" in en-GB; "1.234,50 €" in de-DE). Refuses, with a
 * sentence saying what to type, anything it cannot read without guessing: "26,90" in en-GB is not
 * £2,690 and not £26.90 (a comma there groups thousands), so it is refused rather than misread.
 * More decimals than the currency has (GBP 2, JPY 0) are refused, never rounded.
 */
export function readMoney(text: string, currency: string, locale = 'en-GB'): MoneyReading {
  const digits = currencyDigits(currency);
  const { decimal, group } = separatorsOf(locale);
  const example = new Intl.NumberFormat(locale, { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: true }).format(1234.5);
  const hint = `type the amount like ${example}`;
  const trimmed = text.trim();
  if (trimmed === '') return { ok: false, message: 'enter an amount' };
  // Drop the currency's symbol or code and any letters around the number, keep what matters.
  const bare = trimmed.replace(new RegExp(`${escape(currency)}|[^\\d\\s${escape(decimal)}${escape(group)}.,'’+-]`, 'giu'), '').trim();
  const sign = /^[-+]/.exec(bare)?.[0] ?? '';
  const body = [...bare.slice(sign.length).trim()].map((c) => (isSpace(c) && isSpace(group) ? group : c)).join('');
  const grouped = new RegExp(`^\\d{1,3}(?:${escape(group)}\\d{3})+`);
  const plain = /^\d+/;
  const whole = grouped.exec(body)?.[0] ?? plain.exec(body)?.[0];
  if (whole === undefined) {
    // ".50" means fifty pence in every locale we know; anything else has no digits to read.
    if (!body.startsWith(decimal)) return { ok: false, message: `${trimmed} is not an amount: ${hint}` };
  }
  const rest = body.slice(whole?.length ?? 0);
  let fraction = '';
  if (rest !== '') {
    const m = new RegExp(`^${escape(decimal)}(\\d*)$`).exec(rest);
    if (!m) return { ok: false, message: `${trimmed} cannot be read as an amount here: ${hint}` };
    fraction = m[1];
  }
  if (fraction.length > digits)
    return { ok: false, message: digits === 0 ? `${currency} amounts have no decimals: ${hint}` : `use at most ${digits} decimal places: ${hint}` };
  const wholeDigits = (whole ?? '0').split(group).join('');
  const minor = Number(wholeDigits) * 10 ** digits + Number(fraction.padEnd(digits, '0') || '0');
  if (!Number.isSafeInteger(minor)) return { ok: false, message: `${trimmed} is too large` };
  return { ok: true, minor: sign === '-' ? -minor : minor };
}

/** `readMoney` for callers that only need the value: minor units, or null when it cannot be read. */
export function parseMoney(text: string, currency: string, locale = 'en-GB'): number | null {
  const r = readMoney(text, currency, locale);
  return r.ok ? r.minor : null;
}

/** Minor units as the text a person would type in `locale`, no grouping: 123456 GBP en-GB → "1234.56", EUR de-DE → "1234,56". */
export function formatMoneyInput(minor: number, currency: string, locale = 'en-GB'): string {
  const digits = currencyDigits(currency);
  return new Intl.NumberFormat(locale, { useGrouping: false, minimumFractionDigits: digits, maximumFractionDigits: digits }).format(minor / 10 ** digits);
}
