import { LOFT_SHAPES, type JobComparison, type LoftShape } from './estimate-vs-actual';

/** m² laid per person-hour by one installer (the jobs' area shared by each installer's hours). */
export interface InstallerRate {
  userId: string;
  name: string;
  jobs: number;
  hours: number;
  areaM2: number;
  m2PerHour: number;
}

/** m² per person-hour on jobs of one loft shape. */
export interface ShapeRate {
  shape: LoftShape;
  jobs: number;
  hours: number;
  areaM2: number;
  m2PerHour: number;
}

/** How far one estimator's jobs were off, as the mean of each job's error, percent (positive = over-estimated). */
export interface EstimatorError {
  estimatorId: string;
  name: string;
  jobs: number;
  meanRollsErrorPct: number | null;
  meanHoursErrorPct: number | null;
}

/** Sums over the period's compared jobs. */
export interface ReportTotals {
  jobsCounted: number;
  estimatedRolls: number;
  usedRolls: number;
  returnedRolls: number;
  estimatedHours: number;
  actualHours: number;
  /** Pooled over the jobs with roll actuals: roll area used over area laid, less one, percent. */
  wasteIncurredPct: number | null;
  /** Mean allowance the takeoffs used on those jobs, percent. */
  wasteAllowancePct: number | null;
  estimatedCostMinor: number;
  actualCostMinor: number;
  priceMinor: number;
  actualMarginMinor: number;
}

const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);
const round = (n: number, digits = 2) => Math.round(n * 10 ** digits) / 10 ** digits;
const mean = (xs: readonly number[]) => (xs.length ? round(sum(xs) / xs.length) : null);

/**
 * Period totals. Waste is pooled (total roll area used over total area laid on the jobs with roll
 * actuals), so a big job weighs more than a small one. Margin and price count only priced jobs.
 */
export function reportTotals(rows: readonly JobComparison[]): ReportTotals {
  const withRolls = rows.filter((r) => r.usedRolls !== null);
  const rec = withRolls.flatMap((r) => r.products.filter((p) => p.used !== null));
  const area = sum(rec.map((p) => p.areaM2));
  const used = sum(rec.map((p) => (p.used ?? 0) * p.coverageM2));
  const priced = rows.filter((r) => r.priceMinor !== null);
  return {
    jobsCounted: rows.length,
    estimatedRolls: sum(rows.map((r) => r.estimatedRolls)),
    usedRolls: sum(withRolls.map((r) => r.usedRolls ?? 0)),
    returnedRolls: sum(withRolls.map((r) => r.returnedRolls ?? 0)),
    estimatedHours: round(sum(rows.map((r) => r.estimatedHours)), 3),
    actualHours: round(sum(rows.map((r) => r.actualHours ?? 0)), 3),
    wasteIncurredPct: area > 0 ? round((used / area - 1) * 100) : null,
    wasteAllowancePct: mean(withRolls.map((r) => r.wasteAllowancePct)),
    estimatedCostMinor: sum(rows.map((r) => r.estimatedMaterialCostMinor + r.estimatedLabourCostMinor)),
    actualCostMinor: sum(rows.map((r) => r.actualMaterialCostMinor + r.actualLabourCostMinor)),
    priceMinor: sum(priced.map((r) => r.priceMinor ?? 0)),
    actualMarginMinor: sum(priced.map((r) => r.actualMarginMinor ?? 0)),
  };
}

/**
 * m² per person-hour by installer: each job's laid area is shared among its installers by their
 * hours, so an installer's rate is their share of area over their hours. Jobs without hours are skipped.
 */
export function ratesByInstaller(rows: readonly JobComparison[]): InstallerRate[] {
  const by = new Map<string, InstallerRate>();
  for (const r of rows) {
    const total = r.actualHours ?? 0;
    if (total <= 0) continue;
    for (const h of r.hours) {
      const x = by.get(h.userId) ?? { userId: h.userId, name: h.name, jobs: 0, hours: 0, areaM2: 0, m2PerHour: 0 };
      x.jobs += 1;
      x.hours += h.hours;
      x.areaM2 += (r.laidAreaM2 * h.hours) / total;
      by.set(h.userId, x);
    }
  }
  return [...by.values()]
    .map((x) => ({ ...x, hours: round(x.hours, 3), areaM2: round(x.areaM2, 3), m2PerHour: x.hours > 0 ? round(x.areaM2 / x.hours) : 0 }))
    .sort((a, b) => a.name.localeCompare(b.name));
}

/** m² per person-hour by loft shape, over the jobs with hours; shapes without jobs are left out. */
export function ratesByShape(rows: readonly JobComparison[]): ShapeRate[] {
  return LOFT_SHAPES.flatMap((shape) => {
    const js = rows.filter((r) => r.loftShape === shape && (r.actualHours ?? 0) > 0);
    if (!js.length) return [];
    const hours = sum(js.map((r) => r.actualHours ?? 0));
    const areaM2 = sum(js.map((r) => r.laidAreaM2));
    return [{ shape, jobs: js.length, hours: round(hours, 3), areaM2: round(areaM2, 3), m2PerHour: round(areaM2 / hours) }];
  });
}

/** Mean roll and hour error per estimator (jobs with no known estimator are left out). */
export function errorsByEstimator(rows: readonly JobComparison[]): EstimatorError[] {
  const by = new Map<string, { name: string; rows: JobComparison[] }>();
  for (const r of rows) {
    if (!r.estimator) continue;
    const x = by.get(r.estimator.id) ?? { name: r.estimator.name, rows: [] };
    x.rows.push(r);
    by.set(r.estimator.id, x);
  }
  return [...by.entries()]
    .map(([estimatorId, x]) => ({
      estimatorId,
      name: x.name,
      jobs: x.rows.length,
      meanRollsErrorPct: mean(x.rows.flatMap((r) => (r.rollsErrorPct === null ? [] : [r.rollsErrorPct]))),
      meanHoursErrorPct: mean(x.rows.flatMap((r) => (r.hoursErrorPct === null ? [] : [r.hoursErrorPct]))),
    }))
    .sort((a, b) => a.name.localeCompare(b.name));
}

/** How far off a job was in money: |actual cost − estimated cost|, minor units. */
export function costMissMinor(r: JobComparison): number {
  return Math.abs(r.actualMaterialCostMinor + r.actualLabourCostMinor - (r.estimatedMaterialCostMinor + r.estimatedLabourCostMinor));
}

/** The `limit` jobs whose cost was furthest from the estimate, furthest first (ties by reference). */
export function furthestOff(rows: readonly JobComparison[], limit = 5): JobComparison[] {
  return [...rows].sort((a, b) => costMissMinor(b) - costMissMinor(a) || a.reference.localeCompare(b.reference)).slice(0, limit);
}
