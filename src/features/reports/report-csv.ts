import type { ReportRow } from '../../../shared/api/actuals';

const COLUMNS: [string, (r: ReportRow) => string | number | null][] = [
  ['reference', (r) => r.reference],
  ['finished', (r) => r.finishedAt.slice(0, 10)],
  ['estimator', (r) => r.estimator?.name ?? ''],
  ['loft shape', (r) => r.loftShape],
  ['area m2', (r) => r.laidAreaM2],
  ['rolls by packing', (r) => r.packingRolls],
  ['rolls by rule of thumb', (r) => r.ruleOfThumbRolls],
  ['rolls estimated', (r) => r.estimatedRolls],
  ['rolls used', (r) => r.usedRolls],
  ['rolls returned', (r) => r.returnedRolls],
  ['waste allowance %', (r) => r.wasteAllowancePct],
  ['waste incurred %', (r) => r.wasteIncurredPct],
  ['hours estimated', (r) => r.estimatedHours],
  ['hours actual', (r) => r.actualHours],
  ['m2 per hour', (r) => r.m2PerHour],
  ['material cost estimated (minor)', (r) => r.estimatedMaterialCostMinor],
  ['material cost actual (minor)', (r) => r.actualMaterialCostMinor],
  ['labour cost estimated (minor)', (r) => r.estimatedLabourCostMinor],
  ['labour cost actual (minor)', (r) => r.actualLabourCostMinor],
  ['price before tax (minor)', (r) => r.priceMinor],
  ['margin estimated (minor)', (r) => r.estimatedMarginMinor],
  ['margin actual (minor)', (r) => r.actualMarginMinor],
];

const cell = (v: string | number | null) => {
  const s = v === null ? '' : String(v);
  // Quote anything with a separator or quote; a leading = + - @ is prefixed so a spreadsheet does not run it as a formula.
  const safe = /^[=+\-@]/.test(s) && typeof v === 'string' ? `'${s}` : s;
  return /[",\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
};

/** The report's rows as CSV (comma-separated, a header line, money in minor units, blank where nothing was recorded). */
export function reportCsv(rows: readonly ReportRow[]): string {
  return [COLUMNS.map(([h]) => h).join(','), ...rows.map((r) => COLUMNS.map(([, f]) => cell(f(r))).join(','))].join('\n') + '\n';
}
