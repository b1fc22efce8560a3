/**
 * Estimate against actual: what a finished job's takeoff and quote expected beside what the
 * installers recorded on finishing. Pure: the server gathers the facts per job, this compares them.
 * Money in integer minor units, areas m², hours are person-hours, percentages are percent (10 = 10%).
 */

/** Loft shape classes for the m²-per-hour table, by the corners of the job's largest space. */
export const LOFT_SHAPES = ['four-corners', 'l-shape', 'irregular'] as const;
export type LoftShape = (typeof LOFT_SHAPES)[number];
export const LOFT_SHAPE_LABELS: Record<LoftShape, string> = { 'four-corners': 'Four corners', 'l-shape': 'L-shape', irregular: 'More corners' };

/** The shape class of an outline with `corners` points: 4 → four corners, 6 → L-shape, anything else irregular. */
export function loftShapeOf(corners: number): LoftShape {
  if (corners === 4) return 'four-corners';
  if (corners === 6) return 'l-shape';
  return 'irregular';
}

/** One product of a job: what the takeoff counted and what was recorded (null when not recorded). */
export interface ProductFacts {
  productId: string;
  productName: string;
  /** Net area the product's layers cover, m². */
  areaM2: number;
  /** Area one roll covers, m² (the catalogue's coverage). */
  coverageM2: number;
  byPacking: number;
  byRuleOfThumb: number;
  used: number | null;
  returned: number | null;
  unitCostMinor: number;
}

/** One extra of a job: the estimated quantity (quote or van load) and the recorded one. */
export interface ExtraFacts {
  code: string;
  label: string;
  estimated: number;
  used: number | null;
  unitCostMinor: number;
}

/** Everything the comparison needs about one finished job. */
export interface JobFacts {
  jobId: string;
  reference: string;
  /** When it was marked installed (ISO). */
  finishedAt: string;
  estimator: { id: string; name: string } | null;
  loftShape: LoftShape;
  /** The waste allowance the takeoff used, percent. */
  wasteAllowancePct: number;
  /** The count the company orders by (its roll-count method at the time). */
  rollCountMethod: 'packing' | 'area';
  products: ProductFacts[];
  extras: ExtraFacts[];
  /** Laid area per layer role, m². */
  areaM2: { base: number; cross: number };
  /** Person-hours the quote allowed (its labour lines), or the company's rates when there is no quote. */
  estimatedHours: number;
  /** Of those, the hours for fitting extras (not laying). */
  extraHours: number;
  hours: { userId: string; name: string; hours: number }[];
  hourlyCostMinor: number;
  /** The accepted quote's price before tax; null without one. */
  priceMinor: number | null;
}

/** One job's estimate against actual. Null fields: nothing was recorded to compare with. */
export interface JobComparison {
  jobId: string;
  reference: string;
  finishedAt: string;
  estimator: { id: string; name: string } | null;
  loftShape: LoftShape;
  products: (ProductFacts & { estimated: number })[];
  extras: ExtraFacts[];
  estimatedRolls: number;
  packingRolls: number;
  ruleOfThumbRolls: number;
  usedRolls: number | null;
  returnedRolls: number | null;
  wasteAllowancePct: number;
  /** Roll area used over the area laid, less one, percent; null without roll actuals. */
  wasteIncurredPct: number | null;
  /** (estimated − used) / used, percent: positive means more was ordered than went in. */
  rollsErrorPct: number | null;
  laidAreaM2: number;
  estimatedHours: number;
  actualHours: number | null;
  hoursErrorPct: number | null;
  m2PerHour: number | null;
  /** Estimated laying hours at the rates given over the actual laying hours (> 1: laying went slower than the rates say). */
  layingRateFactor: number | null;
  estimatedMaterialCostMinor: number;
  actualMaterialCostMinor: number;
  estimatedLabourCostMinor: number;
  actualLabourCostMinor: number;
  priceMinor: number | null;
  estimatedMarginMinor: number | null;
  actualMarginMinor: number | null;
  hours: JobFacts['hours'];
}

const sum = (xs: readonly number[]) => xs.reduce((a, b) => a + b, 0);
const round = (n: number, digits = 2) => Math.round(n * 10 ** digits) / 10 ** digits;

/**
 * Compares one job. Rolls: `used` is what went into the loft (opened), `returned` the unopened rolls
 * brought back, which cost nothing. The estimate is the count the company orders by. Where an
 * actual is missing (rolls, an extra, hours) its cost is taken as estimated, so a difference only
 * ever comes from what was recorded. `rates` are the laying speeds to judge the hours against.
 */
export function compareJob(f: JobFacts, rates: { baseM2PerHour: number; crossM2PerHour: number }): JobComparison {
  const products = f.products.map((p) => ({ ...p, estimated: f.rollCountMethod === 'packing' ? p.byPacking : p.byRuleOfThumb }));
  const recorded = products.filter((p) => p.used !== null);
  const usedRolls = recorded.length ? sum(recorded.map((p) => p.used ?? 0)) : null;
  const returnedRolls = recorded.length ? sum(recorded.map((p) => p.returned ?? 0)) : null;
  const estimatedRolls = sum(products.map((p) => p.estimated));
  const recordedArea = sum(recorded.map((p) => p.areaM2));
  const usedArea = sum(recorded.map((p) => (p.used ?? 0) * p.coverageM2));
  const wasteIncurredPct = recorded.length && recordedArea > 0 ? round((usedArea / recordedArea - 1) * 100) : null;
  const recordedEstimate = sum(recorded.map((p) => p.estimated));
  const rollsErrorPct = usedRolls ? round(((recordedEstimate - usedRolls) / usedRolls) * 100) : null;

  const actualHours = f.hours.length ? round(sum(f.hours.map((h) => h.hours)), 3) : null;
  const laidAreaM2 = round(f.areaM2.base + f.areaM2.cross, 3);
  const layingEstimate = f.areaM2.base / rates.baseM2PerHour + f.areaM2.cross / rates.crossM2PerHour;
  const layingActual = actualHours === null ? 0 : actualHours - f.extraHours;

  const estMaterial = sum(products.map((p) => p.estimated * p.unitCostMinor)) + sum(f.extras.map((x) => x.estimated * x.unitCostMinor));
  const actMaterial = sum(products.map((p) => (p.used ?? p.estimated) * p.unitCostMinor)) + sum(f.extras.map((x) => (x.used ?? x.estimated) * x.unitCostMinor));
  const estLabour = Math.round(f.estimatedHours * f.hourlyCostMinor);
  const actLabour = Math.round((actualHours ?? f.estimatedHours) * f.hourlyCostMinor);
  const margin = (cost: number) => (f.priceMinor === null ? null : f.priceMinor - cost);
  return {
    jobId: f.jobId,
    reference: f.reference,
    finishedAt: f.finishedAt,
    estimator: f.estimator,
    loftShape: f.loftShape,
    products,
    extras: f.extras,
    estimatedRolls,
    packingRolls: sum(products.map((p) => p.byPacking)),
    ruleOfThumbRolls: sum(products.map((p) => p.byRuleOfThumb)),
    usedRolls,
    returnedRolls,
    wasteAllowancePct: f.wasteAllowancePct,
    wasteIncurredPct,
    rollsErrorPct,
    laidAreaM2,
    estimatedHours: f.estimatedHours,
    actualHours,
    hoursErrorPct: actualHours ? round(((f.estimatedHours - actualHours) / actualHours) * 100) : null,
    m2PerHour: actualHours ? round(laidAreaM2 / actualHours) : null,
    layingRateFactor: layingActual > 0 && layingEstimate > 0 ? round(layingActual / layingEstimate, 4) : null,
    estimatedMaterialCostMinor: Math.round(estMaterial),
    actualMaterialCostMinor: Math.round(actMaterial),
    estimatedLabourCostMinor: estLabour,
    actualLabourCostMinor: actLabour,
    priceMinor: f.priceMinor,
    estimatedMarginMinor: margin(Math.round(estMaterial) + estLabour),
    actualMarginMinor: margin(Math.round(actMaterial) + actLabour),
    hours: f.hours,
  };
}
