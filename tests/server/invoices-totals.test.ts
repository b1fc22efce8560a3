// Invoice arithmetic against hand-worked examples. UK VAT rates 20 % standard, 5 % reduced and
// 0 % for installed energy-saving materials are from HMRC VAT Notice 708/6; the
// sums themselves were worked by hand, line by line, and are written out beside each row.
import { describe, expect, it } from 'vitest';
import { addDaysIso as addDays } from '../../shared/dates';
import { balanceDue, isOverdue, lineAmounts, sumLines } from '../../server/modules/invoices/invoice-totals';
import { depositFor } from '../../shared/quote/deposit';
import { computeQuoteTotals } from '../../shared/quote/totals';
import { UK_DEFAULT_TAX_RATES } from '../../shared/quote/tax';

describe('one invoice line', () => {
  it.each([
    // quantity, unitPriceMinor, rateBp, net, tax — worked by hand
    [12, 2350, 0, 28200, 0], // 12 rolls × £23.50 = £282.00, zero-rated
    [6.5, 3800, 2000, 24700, 4940], // 6.5 h × £38.00 = £247.00; 20 % = £49.40
    [3, 1299, 2000, 3897, 779], // 3 × £12.99 = £38.97; 20 % = 779.4p → 779p
    [4, 749, 2000, 2996, 599], // 4 × £7.49 = £29.96; 20 % = 599.2p → 599p
    [1.5, 333, 500, 500, 25], // 1.5 × 333p = 499.5p → 500p (half away from zero); 5 % = 25p
    [1, 10, 500, 10, 1], // 10p at 5 % = 0.5p → 1p
    [1, -10, 500, -10, -1], // a credit: −0.5p → −1p, symmetric with the charge
    [1, -2350, 2000, -2350, -470],
  ])('qty %d at %ip, VAT %i bp → net %i, VAT %i', (q, unit, rate, net, tax) => {
    expect(lineAmounts({ quantity: q, unitPriceMinor: unit, rateBp: rate })).toEqual({ netMinor: net, taxMinor: tax, grossMinor: net + tax });
  });

  it('refuses fractional minor units with a clear error', () => {
    expect(() => lineAmounts({ quantity: 1, unitPriceMinor: 12.5, rateBp: 2000 })).toThrow(/whole number of minor units/);
  });

  it('prices a line exactly as the quote does (same money helpers, same tax date)', () => {
    // 1 May 2027: installed energy-saving materials 5 %, other items 20 % (HMRC VAT Notice 708/6).
    const lines = [
      {
        kind: 'material' as const,
        description: 'roll',
        quantity: 13,
        unit: 'roll',
        unitPriceMinor: 2899,
        unitCostMinor: 0,
        taxClass: 'energy_saving' as const,
      },
      { kind: 'extra' as const, description: 'boards', quantity: 2.345, unit: 'm', unitPriceMinor: 199, unitCostMinor: 0, taxClass: 'standard' as const },
    ];
    const q = computeQuoteTotals(lines, UK_DEFAULT_TAX_RATES, '2027-05-01');
    const mine = q.lines.map((p) => ({
      ...lineAmounts({ quantity: p.line.quantity, unitPriceMinor: p.line.unitPriceMinor, rateBp: p.rateBp }),
      rateBp: p.rateBp,
    }));
    expect(mine.map((m) => [m.netMinor, m.taxMinor])).toEqual([
      [37687, 1884],
      [467, 93],
    ]); // 13 × 2899 = 37687, 5 % = 1884.35 → 1884; 2.345 × 199 = 466.655 → 467, 20 % = 93.4 → 93
    expect(sumLines(mine).grossMinor).toBe(q.grossMinor);
  });
});

describe('invoice totals', () => {
  const lines = [
    [12, 2350, 0],
    [6.5, 3800, 2000],
    [3, 1299, 2000],
    [4, 749, 2000],
    [1.5, 333, 500],
  ].map(([q, u, r]) => ({ ...lineAmounts({ quantity: q, unitPriceMinor: u, rateBp: r }), rateBp: r }));

  it('sums net 602.93, VAT 63.43, total 666.36 with VAT grouped by rate (hand-worked)', () => {
    const t = sumLines(lines);
    expect(t).toEqual({
      netMinor: 60293, // 28200 + 24700 + 3897 + 2996 + 500
      taxMinor: 6343, // 0 + 4940 + 779 + 599 + 25
      grossMinor: 66636,
      taxByRate: [
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
