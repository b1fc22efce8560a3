import { describe, expect, it } from 'vitest';
import { formatMoneyInput, parseMoney, readMoney } from '../../shared/quote/money-input';

// Decimal and grouping marks per locale are CLDR's, as Intl reports them: en-GB "1,234.50",
// de-DE "1.234,50", fr-FR "1 234,50" (narrow no-break space).
describe('reading amounts people type', () => {
  it.each([
    ['26.90', 'GBP', 'en-GB', 2690],
    ['£26.90', 'GBP', 'en-GB', 2690],
    ['1,234.5', 'GBP', 'en-GB', 123450],
    ['  1234 ', 'GBP', 'en-GB', 123400],
    ['.50', 'GBP', 'en-GB', 50],
    ['-12', 'GBP', 'en-GB', -1200],
    ['GBP 12.00', 'GBP', 'en-GB', 1200],
    ['26,90', 'EUR', 'de-DE', 2690],
    ['1.234,50 €', 'EUR', 'de-DE', 123450],
    ['1 234,50', 'EUR', 'fr-FR', 123450],
    ['1\u202f234,50', 'EUR', 'fr-FR', 123450],
    ['1,234', 'JPY', 'ja-JP', 1234],
  ] as const)('reads %s (%s, %s) as %s minor units', (text, currency, locale, minor) => {
    expect(readMoney(text, currency, locale)).toEqual({ ok: true, minor });
  });

  it('refuses "26,90" in en-GB instead of reading £2,690.00, and says how to type it', () => {
    const r = readMoney('26,90', 'GBP', 'en-GB');
    expect(r.ok).toBe(false);
    expect(!r.ok && r.message).toMatch(/1,234\.50/);
    expect(parseMoney('26,90', 'GBP', 'en-GB')).toBeNull();
  });

  it.each([
    ['', 'GBP', 'en-GB', /enter an amount/],
    ['abc', 'GBP', 'en-GB', /not an amount/],
    ['1.999', 'GBP', 'en-GB', /at most 2 decimal places/],
    ['12.5', 'JPY', 'ja-JP', /no decimals/],
    ['1,23,4', 'GBP', 'en-GB', /cannot be read/],
    ['26.90', 'EUR', 'de-DE', /cannot be read/],
    ['1.2.3', 'GBP', 'en-GB', /cannot be read/],
  ] as const)('refuses %j (%s, %s)', (text, currency, locale, message) => {
    const r = readMoney(text, currency, locale);
    expect(r.ok).toBe(false);
    expect(!r.ok && r.message).toMatch(message);
  });
});

describe('amounts written back into an input', () => {
  it.each([
    [123456, 'GBP', 'en-GB', '1234.56'],
    [123456, 'EUR', 'de-DE', '1234,56'],
    [1234, 'JPY', 'ja-JP', '1234'],
  ] as const)('writes %s %s in %s as %j, which reads back the same', (minor, currency, locale, text) => {
    expect(formatMoneyInput(minor, currency, locale)).toBe(text);
    expect(readMoney(text, currency, locale)).toEqual({ ok: true, minor });
  });
});
