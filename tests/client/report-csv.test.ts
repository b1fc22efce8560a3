import { describe, expect, it } from 'vitest';
import { compareJob } from '../../shared/reports/estimate-vs-actual';
import { reportCsv } from '../../src/features/reports/report-csv';

const row = compareJob(
  {
    jobId: 'j1',
    reference: 'JOB-2026-0001',
    finishedAt: '2026-11-03T15:30:00Z',
    estimator: { id: 'e', name: 'Ellis "Ell" Harper, senior' },
    loftShape: 'l-shape',
    wasteAllowancePct: 10,
    rollCountMethod: 'packing',
    products: [{ productId: 'p', productName: 'Roll', areaM2: 30, coverageM2: 5, byPacking: 7, byRuleOfThumb: 7, used: 8, returned: 0, unitCostMinor: 1000 }],
    extras: [],
    areaM2: { base: 30, cross: 0 },
    estimatedHours: 3,
    extraHours: 0,
    hours: [{ userId: 'u', name: 'Ian', hours: 4 }],
    hourlyCostMinor: 2000,
    priceMinor: null,
  },
  { baseM2PerHour: 10, crossM2PerHour: 15 },
);

describe('report CSV', () => {
  it('writes a header and one line per job, quoting text with commas or quotes and leaving unrecorded values blank', () => {
    const lines = reportCsv([row]).trimEnd().split('\n');
    expect(lines).toHaveLength(2);
    const header = lines[0].split(',');
    expect(header.slice(0, 3)).toEqual(['reference', 'finished', 'estimator']);
    expect(lines[1].startsWith('JOB-2026-0001,2026-11-03,"Ellis ""Ell"" Harper, senior",l-shape,30,7,7,7,8,0,10,33.33,3,4,7.5')).toBe(true);
    // No quote: price and margins are empty.
    expect(lines[1].endsWith(',,,')).toBe(true);
  });
});
