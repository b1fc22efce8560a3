// Invoice arithmetic against hand-worked examples. UK VAT rates 20 % standard, 5 % reduced and
// 0 % for installed energy-saving materials are from HMRC VAT Notice 708/6 (REFERENCES.md); the
// sums themselves were worked by hand, line by line, and are written out beside each row.
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { addDays, balanceDue, depositFor, divRoundHalfAway, isOverdue, lineAmounts, sumLines } from '../../server/modules/invoices/invoice-totals';

describe('one invoice line', () => {
  it.each([
    // quantityMilli, unitPriceMinor, taxRateBp, net, tax — worked by hand
    [12000, 2350, 0, 28200, 0], // 12 rolls × £23.50 = £282.00, zero-rated
    [6500, 3800, 2000, 24700, 4940], // 6.5 h × £38.00 = £247.00; 20 % = £49.40
    [3000, 1299, 2000, 3897, 779], // 3 × £12.99 = £38.97; 20 % = 779.4p → 779p
    [4000, 749, 2000, 2996, 599], // 4 × £7.49 = £29.96; 20 % = 599.2p → 599p
    [1500, 333, 500, 500, 25], // 1.5 × 333p = 499.5p → 500p (half away from zero); 5 % = 25p
    [1000, 10, 500, 10, 1], // 10p at 5 % = 0.5p → 1p
    [1000, -10, 500, -10, -1], // a credit: −0.5p → −1p, symmetric with the charge
    [1000, -2350, 2000, -2350, -470],
  ])('qty %i/1000 at %ip, VAT %i bp → net %i, VAT %i', (q, unit, rate, net, tax) => {
    expect(lineAmounts({ quantityMilli: q, unitPriceMinor: unit, taxRateBp: rate })).toEqual({ netMinor: net, taxMinor: tax, grossMinor: net + tax });
  });

  it('refuses fractional minor units with a clear error', () => {
    expect(() => lineAmounts({ quantityMilli: 1000, unitPriceMinor: 12.5, taxRateBp: 2000 })).toThrow(/unitPriceMinor must be an integer/);
  });

  it('rounds exactly where floating point would not (BigInt inside)', () => {
    // 0.5 + 2^52 is not representable as a double; the integer division still rounds correctly.
    expect(divRoundHalfAway(9007199254740990n * 1000n + 500n, 1000n)).toBe(9007199254740991);
    fc.assert(
      fc.property(fc.integer({ min: -1e9, max: 1e9 }), fc.integer({ min: 1, max: 1e6 }), (a, b) => {
        const r = divRoundHalfAway(BigInt(a), BigInt(b));
        expect(Math.abs(r - a / b)).toBeLessThanOrEqual(0.5 + 1e-9);
        expect(divRoundHalfAway(BigInt(-a), BigInt(b))).toBe(-r || 0);
      }),
    );
  });
});

describe('invoice totals', () => {
  const lines = [
    [12000, 2350, 0],
    [6500, 3800, 2000],
    [3000, 1299, 2000],
    [4000, 749, 2000],
    [1500, 333, 500],
  ].map(([q, u, r]) => ({ ...lineAmounts({ quantityMilli: q, unitPriceMinor: u, taxRateBp: r }), taxRateBp: r }));

  it('sums net 602.93, VAT 63.43, total 666.36 with VAT grouped by rate (hand-worked)', () => {
    const t = sumLines(lines);
    expect(t).toEqual({
      netMinor: 60293, // 28200 + 24700 + 3897 + 2996 + 500
      taxMinor: 6343, // 0 + 4940 + 779 + 599 + 25
      totalMinor: 66636,
      taxBreakdown: [
        { rateBp: 2000, netMinor: 31593, taxMinor: 6318 },
        { rateBp: 500, netMinor: 500, taxMinor: 25 },
        { rateBp: 0, netMinor: 28200, taxMinor: 0 },
      ],
    });
  });

  it('takes a 25 % deposit of £166.59 and leaves £499.77 to pay (hand-worked)', () => {
    const deposit = depositFor(66636, 'percent', 2500, null); // 66636 / 4 = 16659
    expect(deposit).toBe(16659);
    expect(balanceDue(66636, deposit, 0)).toBe(49977);
    expect(balanceDue(66636, deposit, 1000)).toBe(48977);
    expect(balanceDue(100, 80, 50)).toBe(0);
  });

  it.each([
    ['none', null, null, 0],
    ['percent', 1000, null, 6664], // 6663.6 → 6664
    ['percent', 3333, null, 22210], // 66636 × 0.3333 = 22209.78 → 22210
    ['fixed', null, 10000, 10000],
    ['fixed', null, 100000, 66636], // never more than the quote
  ] as const)('deposit %s %s/%s on £666.36 → %i', (mode, bp, fixed, expected) => {
    expect(depositFor(66636, mode, bp, fixed)).toBe(expected);
  });

  it('works out due dates across month and leap-year ends and flags overdue from the next day', () => {
    expect(addDays('2027-01-20', 14)).toBe('2027-02-03');
    expect(addDays('2028-02-20', 14)).toBe('2028-03-05'); // 2028 is a leap year: 29 February counts
    expect(addDays('2027-12-25', 30)).toBe('2028-01-24');
    expect(isOverdue('issued', '2027-02-03', '2027-02-03')).toBe(false);
    expect(isOverdue('issued', '2027-02-03', '2027-02-04')).toBe(true);
    expect(isOverdue('paid', '2027-02-03', '2027-03-01')).toBe(false);
  });
});
