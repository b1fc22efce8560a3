import { describe, expect, it } from 'vitest';
import { applyRateBp, currencyDigits, formatMoney, minorToDecimalString, multiplyMinor } from '../../shared/quote/money';
import { parseMoney } from '../../shared/quote/money-input';
import { formatRateBp, taxRateOn, UK_DEFAULT_TAX_RATES } from '../../shared/quote/tax';

describe('money in minor units', () => {
  it.each([
    // quantity, unit price (p), working, expected (p)
    [12, 2499, '12 × 2499 = 29988', 29988],
    [5.25, 3250, '5.25 × 3250 = 17062.5 → half up 17063', 17063],
    [2.345, 199, '2.345 × 199 = 466.655 → 467', 467],
    [0.1, 3, '0.1 × 3 = 0.3 → 0', 0],
    [0.5, 1, '0.5 × 1 = 0.5 → half up 1', 1],
    [1.15, 100, '1.15 × 100 = 115 exactly (binary 1.15 is 1.149999…, the quantity is kept in thousandths)', 115],
  ])('multiplies %s × %s p (%s)', (q, p, _working, expected) => {
    expect(multiplyMinor(q, p)).toBe(expected);
  });

  it('adds 0.1 + 0.2 of a pound ten times without drift, unlike floats', () => {
    // 10 × (10 p + 20 p) = 300 p exactly; 10 × (0.1 + 0.2) in floats is 3.0000000000000004.
    let total = 0;
    for (let i = 0; i < 10; i += 1) total += multiplyMinor(0.1, 100) + multiplyMinor(0.2, 100);
    expect(total).toBe(300);
  });

  it.each([
    [1234, 2000, '20% of 1234 = 246.8 → 247', 247],
    [1010, 500, '5% of 1010 = 50.5 → half up 51', 51],
    [-1010, 500, '−50.5 rounds away from zero → −51', -51],
    [47051, 0, 'zero rate', 0],
  ])('takes a rate of an amount: %s at %s bp (%s)', (amount, bp, _w, expected) => {
    expect(applyRateBp(amount, bp)).toBe(expected);
  });

  it('refuses fractional minor units and fractional basis points with a clear error', () => {
    expect(() => multiplyMinor(1, 2.5)).toThrow(/whole number of minor units/);
    expect(() => applyRateBp(100, 2.5)).toThrow(/basis points/);
    expect(() => multiplyMinor(Number.NaN, 2)).toThrow(/finite/);
  });

  it('knows minor digits per currency from Intl (GBP 2, JPY 0, KWD 3)', () => {
    expect([currencyDigits('GBP'), currencyDigits('JPY'), currencyDigits('KWD')]).toEqual([2, 0, 3]);
  });

  it('formats per currency and locale', () => {
    expect(formatMoney(123456, 'GBP', 'en-GB')).toBe('£1,234.56');
    expect(formatMoney(1234, 'JPY', 'ja-JP')).toMatch(/1,234$/);
    expect(formatMoney(123456, 'EUR', 'de-DE').replace(/\s/g, ' ')).toBe('1.234,56 €');
    expect(formatMoney(-5, 'GBP', 'en-GB')).toBe('-£0.05');
  });

  it('writes plain decimals for spreadsheets and reads typed amounts back', () => {
    expect(minorToDecimalString(123456, 'GBP')).toBe('1234.56');
    expect(minorToDecimalString(5, 'GBP')).toBe('0.05');
    expect(minorToDecimalString(-5, 'GBP')).toBe('-0.05');
    expect(minorToDecimalString(1234, 'JPY')).toBe('1234');
    expect(parseMoney('£1,234.5', 'GBP')).toBe(123450);
    expect(parseMoney('0.99', 'GBP')).toBe(99);
    expect(parseMoney('1.999', 'GBP')).toBeNull();
    expect(parseMoney('abc', 'GBP')).toBeNull();
  });
});

describe('dated tax rates', () => {
  // HMRC VAT Notice 708/6, Energy-saving materials and heating equipment: installed energy-saving materials zero-rated
  // 1 May 2023 – 31 March 2027, then 5%; other items standard-rated at 20%.
  it.each([
    ['2023-04-30', 'energy_saving', 500],
    ['2023-05-01', 'energy_saving', 0],
    ['2027-03-31', 'energy_saving', 0],
    ['2027-04-01', 'energy_saving', 500],
    ['2026-12-01', 'standard', 2000],
  ] as const)('on %s the %s rate is %s bp', (date, cls, bp) => {
    expect(taxRateOn(UK_DEFAULT_TAX_RATES, cls, date).rateBp).toBe(bp);
  });

  it('refuses a date no rate covers, naming the class and the date', () => {
    expect(() => taxRateOn(UK_DEFAULT_TAX_RATES, 'standard', '2010-01-01')).toThrow(/standard tax rate applies on 2010-01-01/);
  });

  it('prints rates from basis points', () => {
    expect([formatRateBp(2000), formatRateBp(500), formatRateBp(0), formatRateBp(1250)]).toEqual(['20%', '5%', '0%', '12.5%']);
  });
});
