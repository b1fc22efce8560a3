import { describe, expect, it } from 'vitest';
import { compareJob, loftShapeOf, type JobFacts } from '../../shared/reports/estimate-vs-actual';
import { errorsByEstimator, furthestOff, ratesByInstaller, ratesByShape, reportTotals } from '../../shared/reports/report-summary';
import { median, spreadOf, suggestSettings } from '../../shared/reports/suggestions';

// Three invented finished jobs with round numbers, worked by hand below. One product P: 5 m² a
// roll, cost 1000 a roll; rule of thumb ceil(area × 1.10 / 5) (common practice, 10 % allowance);
// labour cost 2000 an hour; company rates 10 m²/h base, 15 m²/h cross.
const X = { userId: 'x', name: 'Xan' };
const Y = { userId: 'y', name: 'Yve' };
const base = {
  wasteAllowancePct: 10,
  rollCountMethod: 'packing' as const,
  hourlyCostMinor: 2000,
  extras: [] as JobFacts['extras'],
  extraHours: 0,
};
const product = (areaM2: number, byPacking: number, byRuleOfThumb: number, used: number, returned: number) => ({
  productId: 'P',
  productName: 'Roll P',
  areaM2,
  coverageM2: 5,
  byPacking,
  byRuleOfThumb,
  used,
  returned,
  unitCostMinor: 1000,
});
const jobs: JobFacts[] = [
  {
    ...base,
    jobId: 'A',
    reference: 'JOB-A',
    finishedAt: '2026-11-01T10:00:00Z',
    estimator: { id: 'e1', name: 'Esme' },
    loftShape: 'four-corners',
    // 40 m²: rule of thumb ceil(40 × 1.1 / 5) = ceil(8.8) = 9.
    products: [product(40, 9, 9, 9, 1)],
    extras: [{ code: 'hatch_kit', label: 'Hatch kit', estimated: 1, used: 1, unitCostMinor: 2000 }],
    areaM2: { base: 40, cross: 0 },
    estimatedHours: 4,
    extraHours: 0.5,
    hours: [
      { ...X, hours: 3 },
      { ...Y, hours: 2 },
    ],
    priceMinor: 30000,
  },
  {
    ...base,
    jobId: 'B',
    reference: 'JOB-B',
    finishedAt: '2026-11-02T10:00:00Z',
    estimator: { id: 'e2', name: 'Ezra' },
    loftShape: 'four-corners',
    // 20 m²: ceil(20 × 1.1 / 5) = ceil(4.4) = 5.
    products: [product(20, 5, 5, 4, 1)],
    areaM2: { base: 20, cross: 0 },
    estimatedHours: 2,
    hours: [{ ...X, hours: 2.5 }],
    priceMinor: null,
  },
  {
    ...base,
    jobId: 'C',
    reference: 'JOB-C',
    finishedAt: '2026-11-03T10:00:00Z',
    estimator: { id: 'e1', name: 'Esme' },
    loftShape: 'l-shape',
    // 30 m²: ceil(30 × 1.1 / 5) = ceil(6.6) = 7.
    products: [product(30, 7, 7, 8, 0)],
    areaM2: { base: 30, cross: 0 },
    estimatedHours: 3,
    hours: [{ ...Y, hours: 4 }],
    priceMinor: 20000,
  },
];
const rates = { baseM2PerHour: 10, crossM2PerHour: 15 };
const rows = jobs.map((j) => compareJob(j, rates));
const [a, b, c] = rows;

describe('estimate against actual, a hand-worked example', () => {
  it('compares job A as worked by hand', () => {
    // Waste: 9 rolls × 5 m² = 45 m² for 40 m² laid → 45/40 − 1 = 12.5 %. Rolls error (9 − 9)/9 = 0.
    expect(a.wasteIncurredPct).toBe(12.5);
    expect(a.rollsErrorPct).toBe(0);
    expect([a.estimatedRolls, a.usedRolls, a.returnedRolls]).toEqual([9, 9, 1]);
    // Hours: 3 + 2 = 5 against 4 → (4 − 5)/5 = −20 %; 40 m² / 5 h = 8 m²/h.
    expect([a.actualHours, a.hoursErrorPct, a.m2PerHour]).toEqual([5, -20, 8]);
    // Laying: the rates give 40/10 = 4 h; laid in 5 − 0.5 (hatch kit) = 4.5 h → factor 1.125.
    expect(a.layingRateFactor).toBe(1.125);
    // Material 9 × 1000 + 1 × 2000 = 11000 both ways; labour 4 × 2000 = 8000 against 5 × 2000 = 10000.
    expect([a.estimatedMaterialCostMinor, a.actualMaterialCostMinor]).toEqual([11000, 11000]);
    expect([a.estimatedLabourCostMinor, a.actualLabourCostMinor]).toEqual([8000, 10000]);
    // Margin 30000 − 19000 = 11000 expected, 30000 − 21000 = 9000 made.
    expect([a.estimatedMarginMinor, a.actualMarginMinor]).toEqual([11000, 9000]);
  });

  it('compares jobs B and C as worked by hand', () => {
    // B: 4 rolls × 5 = 20 m² for 20 m² → 0 %; (5 − 4)/4 = +25 %; (2 − 2.5)/2.5 = −20 %; factor 2.5 / (20/10) = 1.25; no quote, no margin.
    expect([b.wasteIncurredPct, b.rollsErrorPct, b.hoursErrorPct, b.layingRateFactor]).toEqual([0, 25, -20, 1.25]);
    expect([b.estimatedMarginMinor, b.actualMarginMinor]).toEqual([null, null]);
    // C: 8 × 5 = 40 m² for 30 m² → 33.33 %; (7 − 8)/8 = −12.5 %; (3 − 4)/4 = −25 %; 30/4 = 7.5 m²/h; factor 4/3 = 1.3333.
    expect([c.wasteIncurredPct, c.rollsErrorPct, c.hoursErrorPct, c.m2PerHour, c.layingRateFactor]).toEqual([33.33, -12.5, -25, 7.5, 1.3333]);
  });

  it('sums the period as worked by hand', () => {
    const t = reportTotals(rows);
    // Rolls 9 + 5 + 7 = 21 estimated, 9 + 4 + 8 = 21 used, 1 + 1 + 0 = 2 back; hours 4 + 2 + 3 = 9 against 5 + 2.5 + 4 = 11.5.
    expect([t.jobsCounted, t.estimatedRolls, t.usedRolls, t.returnedRolls, t.estimatedHours, t.actualHours]).toEqual([3, 21, 21, 2, 9, 11.5]);
    // Pooled waste: (45 + 20 + 40) m² used for (40 + 20 + 30) m² laid → 105/90 − 1 = 16.67 %.
    expect(t.wasteIncurredPct).toBe(16.67);
    // Costs: A 19000 → 21000, B (5000 + 4000) → (4000 + 5000), C (7000 + 6000) → (8000 + 8000).
    expect([t.estimatedCostMinor, t.actualCostMinor]).toEqual([41000, 46000]);
    // Priced jobs only (A, C): price 50000, margin made (30000 − 21000) + (20000 − 16000) = 13000.
    expect([t.priceMinor, t.actualMarginMinor]).toEqual([50000, 13000]);
  });

  it('shares m² per hour by installer and by loft shape as worked by hand', () => {
    // Xan: A 3/5 of 40 = 24 m² in 3 h, B 20 m² in 2.5 h → 44 m² / 5.5 h = 8. Yve: A 16 m² in 2 h, C 30 m² in 4 h → 46/6 = 7.67.
    expect(ratesByInstaller(rows).map((r) => [r.name, r.hours, r.areaM2, r.m2PerHour])).toEqual([
      ['Xan', 5.5, 44, 8],
      ['Yve', 6, 46, 7.67],
    ]);
    // Four corners: A + B, 60 m² in 7.5 h = 8; L-shape: C, 30 m² in 4 h = 7.5.
    expect(ratesByShape(rows).map((r) => [r.shape, r.jobs, r.m2PerHour])).toEqual([
      ['four-corners', 2, 8],
      ['l-shape', 1, 7.5],
    ]);
  });

  it('averages each estimator’s error and ranks the jobs furthest off', () => {
    // Esme (A, C): rolls (0 − 12.5)/2 = −6.25, hours (−20 − 25)/2 = −22.5. Ezra (B): +25, −20.
    expect(errorsByEstimator(rows).map((e) => [e.name, e.jobs, e.meanRollsErrorPct, e.meanHoursErrorPct])).toEqual([
      ['Esme', 2, -6.25, -22.5],
      ['Ezra', 1, 25, -20],
    ]);
    // Cost missed by: C 3000, A 2000, B 0.
    expect(furthestOff(rows).map((r) => r.reference)).toEqual(['JOB-C', 'JOB-A', 'JOB-B']);
  });

  it('suggests the median waste and laying speed with a low-confidence note for three jobs', () => {
    const s = suggestSettings(rows, { wasteAllowancePct: 10, ...rates }, 20);
    // Waste values 0, 12.5, 33.33 → median 12.5 (already a 0.5 step). Spread: mean 15.277…, population sd 13.75.
    expect(s.waste?.suggestedPct).toBe(12.5);
    expect(s.waste?.spread).toEqual({ jobs: 3, min: 0, max: 33.33, sd: 13.75 });
    expect(s.waste?.confidence).toBe('low');
    // Laying factors 1.125, 1.25, 1.3333 → median 1.25: 10/1.25 = 8 m²/h base, 15/1.25 = 12 m²/h cross.
    expect(s.laying?.suggested).toEqual({ baseM2PerHour: 8, crossM2PerHour: 12 });
    // Only the newest N count: the newest two jobs are fewer than the three a suggestion needs.
    expect(suggestSettings(rows, { wasteAllowancePct: 10, ...rates }, 2).waste).toBeNull();
  });

  it('leaves a job with nothing recorded uncompared rather than zero', () => {
    const r = compareJob({ ...jobs[0], products: [{ ...jobs[0].products[0], used: null, returned: null }], hours: [], extras: [] }, rates);
    expect([r.usedRolls, r.wasteIncurredPct, r.actualHours, r.hoursErrorPct, r.layingRateFactor]).toEqual([null, null, null, null, null]);
    // Costs without actuals are the estimate, so the margin made equals the margin expected.
    expect(r.actualMarginMinor).toBe(r.estimatedMarginMinor);
  });

  it('has median, spread and shape helpers that agree with a direct reading', () => {
    expect(median([3, 1, 2])).toBe(2);
    expect(median([4, 1, 3, 2])).toBe(2.5);
    expect(spreadOf([2, 4, 4, 4, 5, 5, 7, 9]).sd).toBe(2);
    expect([4, 6, 8, 5].map(loftShapeOf)).toEqual(['four-corners', 'l-shape', 'irregular', 'irregular']);
  });
});
