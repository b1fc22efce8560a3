import { describe, expect, it } from 'vitest';
import { computeQuoteTotals, type QuoteLineInput } from '../../shared/quote/totals';
import { paybackYears } from '../../shared/takeoff/savings';
import { UK_DEFAULT_TAX_RATES } from '../../shared/quote/tax';

const line = (p: Partial<QuoteLineInput> & Pick<QuoteLineInput, 'quantity' | 'unitPriceMinor' | 'taxClass'>): QuoteLineInput => ({
  kind: 'custom',
  description: 'x',
  unit: 'each',
  unitCostMinor: 0,
  ...p,
});

// A hand-worked quote (all amounts in pence):
//   rolls      12     × 2499 = 29988    energy-saving   cost 12 × 1650 = 19800
//   labour     5.25 h × 3250 = 17062.5 → 17063 energy-saving   cost 5.25 × 2000 = 10500
//   covers     3      × 845  = 2535     standard        cost 3 × 400 = 1200
//   lagging    2.345 m × 199 = 466.655 → 467 standard   cost 2.345 × 90 = 211.05 → 211
//   disposal   1      × 3500 = 3500     standard        cost 2000
// net = 29988 + 17063 + 2535 + 467 + 3500 = 53553; cost = 33711; margin = 19842 (37.05%)
const LINES: QuoteLineInput[] = [
  line({ kind: 'material', quantity: 12, unitPriceMinor: 2499, unitCostMinor: 1650, taxClass: 'energy_saving' }),
  line({ kind: 'labour', quantity: 5.25, unitPriceMinor: 3250, unitCostMinor: 2000, taxClass: 'energy_saving' }),
  line({ kind: 'extra', quantity: 3, unitPriceMinor: 845, unitCostMinor: 400, taxClass: 'standard' }),
  line({ kind: 'extra', quantity: 2.345, unitPriceMinor: 199, unitCostMinor: 90, taxClass: 'standard' }),
  line({ kind: 'extra', quantity: 1, unitPriceMinor: 3500, unitCostMinor: 2000, taxClass: 'standard' }),
];

describe('quote totals', () => {
  it('totals a quote dated in the zero-rate period to the penny (VAT Notice 708/6)', () => {
    // 1 December 2026: energy-saving 0%, standard 20%.
    // Tax per line: 0, 0, 2535 × 20% = 507, 467 × 20% = 93.4 → 93, 3500 × 20% = 700 → 1300.
    const t = computeQuoteTotals(LINES, UK_DEFAULT_TAX_RATES, '2026-12-01');
    expect(t.lines.map((l) => l.netMinor)).toEqual([29988, 17063, 2535, 467, 3500]);
    expect(t.lines.map((l) => l.taxMinor)).toEqual([0, 0, 507, 93, 700]);
    expect(t.netMinor).toBe(53553);
    expect(t.taxByRate).toEqual([
      { rateBp: 2000, netMinor: 6502, taxMinor: 1300 },
      { rateBp: 0, netMinor: 47051, taxMinor: 0 },
    ]);
    expect(t.taxMinor).toBe(1300);
    expect(t.grossMinor).toBe(54853);
    expect(t.costMinor).toBe(33711);
    expect(t.marginMinor).toBe(19842);
    // 19842 / 53553 = 0.370511… → 3705 bp
    expect(t.marginBp).toBe(3705);
  });

  it('switches the energy-saving lines to 5% from 1 April 2027 and rounds tax per line, not per bucket', () => {
    // rolls 29988 × 5% = 1499.4 → 1499; labour 17063 × 5% = 853.15 → 853; bucket 2352
    // (rounding the bucket instead would give 47051 × 5% = 2352.55 → 2353: we state per-line rounding).
    const before = computeQuoteTotals(LINES, UK_DEFAULT_TAX_RATES, '2027-03-31');
    const after = computeQuoteTotals(LINES, UK_DEFAULT_TAX_RATES, '2027-04-01');
    expect(before.taxMinor).toBe(1300);
    expect(after.taxByRate).toEqual([
      { rateBp: 2000, netMinor: 6502, taxMinor: 1300 },
      { rateBp: 500, netMinor: 47051, taxMinor: 2352 },
    ]);
    expect(after.grossMinor).toBe(53553 + 1300 + 2352);
  });

  it('rounds each half penny of tax up on its own line', () => {
    // Two lines of 1010 p at 5%: 50.5 → 51 each, 102 in all.
    const t = computeQuoteTotals(
      [line({ quantity: 1, unitPriceMinor: 1010, taxClass: 'energy_saving' }), line({ quantity: 1, unitPriceMinor: 1010, taxClass: 'energy_saving' })],
      UK_DEFAULT_TAX_RATES,
      '2027-06-01',
    );
    expect(t.taxMinor).toBe(102);
    expect(t.grossMinor).toBe(2122);
  });

  it('gives an empty quote zero totals and zero margin', () => {
    const t = computeQuoteTotals([], UK_DEFAULT_TAX_RATES, '2026-12-01');
    expect([t.netMinor, t.taxMinor, t.grossMinor, t.marginBp]).toEqual([0, 0, 0, 0]);
  });

  it('works out payback in years to one decimal, none without a saving', () => {
    // £548.53 / £120.00 a year = 4.57 → 4.6 years
    expect(paybackYears(54853, 12000)).toBe(4.6);
    expect(paybackYears(54853, 0)).toBeNull();
  });
});
