import { z } from 'zod';
import { BOARDED_TREATMENTS, EAVES_MODES, EXCLUSION_KINDS, CONDITIONS, exclusionKindSchema, targetSchema } from '../plan/plan-schema';
import { LAYER_ROLES } from './products';
import { TAKEOFF_FORMAT, type Takeoff } from './takeoff-types';
import type { TakeoffSettings } from './settings';
import type { SiteCheck } from './site-checks';

/*
 * The takeoff artefact: what computeTakeoff returns, what every plan revision stores beside its
 * plan, and what the quote, the van load, the job sheet and the schedule read. One schema; the
 * interfaces in takeoff-types.ts are checked against it at compile time (bottom of this file) and
 * every example's takeoff must parse to itself (tests/shared/takeoff-schema.test.ts), so a field
 * added to the engine without being added here fails both. A change of stored shape bumps
 * TAKEOFF_FORMAT (the shape of each format is recorded in that test); stored revisions of an
 * older format are recomputed at start-up (server/modules/plan-revisions/plan-takeoff.ts).
 */

const num = z.number().finite();
const point = z.tuple([num, num]);
const polygon = z.array(point);
const byKind = <T extends z.ZodType>(v: T) => z.object(Object.fromEntries(EXCLUSION_KINDS.map((k) => [k, v])) as Record<(typeof EXCLUSION_KINDS)[number], T>);

/** Company settings as the takeoff used them (all filled in). Lengths mm, money minor units. */
export const takeoffSettingsSchema = z.object({
  wasteAllowancePct: num,
  cuttingAllowanceMm: num,
  minOffcutMm: num,
  minStripWidthMm: num,
  minStripAreaM2: num,
  degreeDays: num,
  fuelPriceMinorPerKwh: num,
  heatingEfficiency: num,
  roofSpaceResistance: num,
  rsi: num,
  rse: num,
  ceilingBoardMm: num,
  ceilingBoardLambda: num,
  timberLambda: num,
  existingLambda: num,
  clearanceMmByKind: byKind(num),
  pointFootprintRadiusMm: num,
  existingConditionFactor: z.object(Object.fromEntries(CONDITIONS.map((c) => [c, num])) as Record<(typeof CONDITIONS)[number], typeof num>),
  maxCrossLayers: num,
  baseFillToleranceMm: num,
  targetBasis: z.enum(['whole-ceiling', 'insulated-area']),
  eavesMode: z.enum(EAVES_MODES),
  hatchInsulationMm: num,
});

/** A site check the plan raises (shared/takeoff/site-checks.ts). */
export const siteCheckSchema = z.object({
  code: z.string(),
  message: z.string(),
  count: num.optional(),
  exclusionIndices: z.array(z.number().int()).optional(),
});

/** One cut of a strip from a roll lane; rolls and lanes count from 1, lengths mm. */
export const takeoffStripPieceSchema = z.object({
  pieceIndex: z.number().int(),
  lengthMm: num,
  widthMm: num,
  roll: z.number().int(),
  lane: z.number().int(),
  offsetMm: num,
  source: z.enum(['lane', 'lengthwise', 'offcut']),
  from: z.string().optional(),
});

/** One strip of a layer (`lengthMm`/`widthMm` are the cut, mm; polygons in plan mm). */
export const takeoffStripSchema = z.object({
  number: z.number().int(),
  label: z.string(),
  bandIndex: z.number().int(),
  lengthMm: num,
  widthMm: num,
  fullWidth: z.boolean(),
  bandWidthMm: num,
  extentMm: num,
  areaM2: num,
  cutOutM2: num,
  polygons: z.array(polygon),
  labelAt: point,
  pieces: z.array(takeoffStripPieceSchema),
});

/** A roll lane after packing, mm. */
export const takeoffLaneSchema = z.object({
  roll: z.number().int(),
  lane: z.number().int(),
  usedMm: num,
  leftoverMm: num,
  cuts: z.array(z.object({ stripNumber: z.number().int(), pieceIndex: z.number().int(), lengthMm: num, widthMm: num, offsetMm: num })),
});

/** The cut list of one product, roll by roll (see `TakeoffRollPlan`), mm and m². */
export const takeoffRollPlanSchema = z.object({
  productId: z.string(),
  productName: z.string(),
  laneWidthMm: num,
  rollLengthMm: num,
  rolls: z.number().int(),
  rollsLowerBound: z.number().int(),
  rollsByArea: z.number().int(),
  lanes: z.array(
    z.object({
      roll: z.number().int(),
      lane: z.number().int(),
      cuts: z.array(z.object({ label: z.string(), part: z.number().int(), parts: z.number().int(), lengthMm: num, widthMm: num, lengthwise: z.boolean() })),
      leftoverMm: num,
      leftover: z.enum(['keep', 'waste', 'none']),
    }),
  ),
  fromOffcuts: z.array(z.object({ label: z.string(), part: z.number().int(), parts: z.number().int(), lengthMm: num, widthMm: num, from: z.string() })),
  fills: z.array(z.object({ layer: z.string(), count: z.number().int(), areaM2: num })),
  keep: z.array(z.object({ lengthMm: num, widthMm: num, from: z.string() })),
  wastePct: num,
});

/** One layer: the product chosen for it, its strips and its roll plan. */
export const takeoffLayerSchema = z.object({
  role: z.enum(LAYER_ROLES),
  roleIndex: z.number().int(),
  productId: z.string(),
  productName: z.string(),
  thicknessMm: num,
  lambda: num,
  areaM2: num,
  rollLengthMm: num,
  laneWidthMm: num,
  lanesPerRoll: z.number().int(),
  coverageM2PerRoll: num,
  bandWidthMm: num,
  layDirection: point,
  strips: z.array(takeoffStripSchema),
  fills: z.array(z.object({ areaM2: num, widthMm: num, lengthMm: num, at: point })),
  totalStripLengthMm: num,
  coveredAreaM2: num,
  rollsByPacking: z.number().int(),
  rollsByArea: z.number().int(),
  rollsLowerBound: z.number().int(),
  wastePct: num,
  packing: z.object({
    method: z.string(),
    lanesUsed: z.number().int(),
    lanesLowerBound: z.number().int(),
    lanes: z.array(takeoffLaneSchema),
    offcuts: z.array(z.object({ roll: z.number().int(), lane: z.number().int(), lengthMm: num, widthMm: num, reusable: z.boolean() })),
  }),
  priceMinor: num,
});

const thermalStateSchema = z.object({ insulationMm: num, rUpper: num, rLower: num, rTotal: num, rTotalImperial: num, uValue: num, rdsapU: num });

/**
 * The product choice the takeoff made: `plan` when the estimator pinned products in the plan,
 * `catalogue` when the engine chose from the company catalogue. Readers take the layers' products
 * from the artefact; nobody recomputes or pins them again.
 */
export const takeoffProductChoiceSchema = z.object({
  source: z.enum(['plan', 'catalogue']),
  baseProductId: z.string().nullable(),
  crossProductIds: z.array(z.string()),
});

/** The whole `quiltline-takeoff/4` artefact (JSON: no Infinity or NaN). */
export const takeoffSchema = z.object({
  format: z.literal(TAKEOFF_FORMAT),
  planName: z.string(),
  grossAreaM2: num,
  netAreaM2: num,
  excludedAreaM2: num,
  eavesBandAreaM2: num,
  layerAreaM2: num,
  wasteAllowancePct: num,
  existing: z.object({ depthMm: num, condition: z.string(), effectiveDepthMm: num, physicalDepthMm: num, baseNeeded: z.boolean() }),
  target: targetSchema,
  productChoice: takeoffProductChoiceSchema,
  layers: z.array(takeoffLayerSchema),
  rollsPerProduct: z.array(
    z.object({
      productId: z.string(),
      productName: z.string(),
      rollsByPacking: z.number().int(),
      rollsByArea: z.number().int(),
      rollsLowerBound: z.number().int(),
      priceMinor: num,
    }),
  ),
  rollPlan: z.array(takeoffRollPlanSchema),
  uValueBefore: num,
  uValueAfter: num,
  uValueBeforeWholeCeiling: num,
  uValueAfterWholeCeiling: num,
  rValueBeforeImperial: num,
  rValueAfterImperial: num,
  thermal: z.object({
    before: thermalStateSchema,
    after: thermalStateSchema,
    method: z.string(),
    rdsapSource: z.string(),
    targetUValue: num.optional(),
    targetJudgedOn: z.enum(['depth', 'whole-ceiling', 'insulated-area']),
    meetsTarget: z.boolean(),
    wholeCeiling: z.object({
      areaM2: num,
      parts: z.array(z.object({ part: z.string(), areaM2: num, uBefore: num, uAfter: num, basis: z.string() })),
    }),
    depthForTargetUMm: num.nullable().optional(),
  }),
  savings: z.object({
    areaM2: num,
    deltaU: num,
    heatKwhPerYear: num,
    fuelKwhPerYear: num,
    moneyMinorPerYear: num,
    degreeDays: num,
    heatingEfficiency: num,
    fuelPriceMinorPerKwh: num,
    note: z.string(),
  }),
  exclusions: z.object({
    countsByKind: byKind(z.number().int()),
    items: z.array(
      z.object({
        index: z.number().int(),
        kind: exclusionKindSchema,
        label: z.string().optional(),
        boards: z.enum(BOARDED_TREATMENTS).optional(),
        clearanceMm: num,
        insideOutline: z.boolean(),
        footprintAreaM2: num,
        polygons: z.array(polygon),
      }),
    ),
    boardedAreaM2: num,
    raisedBoardedAreaM2: num,
  }),
  eaves: z.object({
    mode: z.enum(EAVES_MODES),
    rafterCentresMm: num,
    ventilatorCount: z.number().int(),
    spanMm: num,
    highLevel: z.object({ needed: z.boolean(), reasons: z.array(z.string()) }),
    gapMm: num,
    totalLengthMm: num,
    bands: z.array(z.object({ edgeIndex: z.number().int(), edgeLengthMm: num, areaM2: num, polygon })),
  }),
  siteChecks: z.array(siteCheckSchema),
  warnings: z.array(
    z.object({
      code: z.string(),
      message: z.string(),
      edgeIndex: z.number().int().optional(),
      exclusionIndex: z.number().int().optional(),
      pointIndex: z.number().int().optional(),
    }),
  ),
  settings: takeoffSettingsSchema,
});

/**
 * A stored value read as a takeoff of the current format, or null when it is missing, of an
 * older format or does not match the schema (the start-up backfill recomputes those).
 */
export function readStoredTakeoff(value: unknown): Takeoff | null {
  const r = takeoffSchema.safeParse(value);
  return r.success ? (r.data as Takeoff) : null;
}

/**
 * The artefact with every price zeroed (per layer, per product, the yearly saving in money and
 * the fuel price), for viewers who never see prices; quantities and the product choice unchanged.
 */
export function takeoffWithoutPrices(t: Takeoff): Takeoff {
  return {
    ...t,
    layers: t.layers.map((l) => ({ ...l, priceMinor: 0 })),
    rollsPerProduct: t.rollsPerProduct.map((r) => ({ ...r, priceMinor: 0 })),
    savings: { ...t.savings, moneyMinorPerYear: 0, fuelPriceMinorPerKwh: 0 },
    settings: { ...t.settings, fuelPriceMinorPerKwh: 0 },
  };
}

// Compile-time: the schema and the interfaces describe the same shape, both ways.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false;
const sameTakeoff: Same<z.infer<typeof takeoffSchema>, Takeoff> = true;
const sameSettings: Same<z.infer<typeof takeoffSettingsSchema>, TakeoffSettings> = true;
const sameSiteCheck: Same<z.infer<typeof siteCheckSchema>, SiteCheck> = true;
void [sameTakeoff, sameSettings, sameSiteCheck];
