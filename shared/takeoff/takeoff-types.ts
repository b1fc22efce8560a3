import type { ExclusionKind, Target } from '../plan/plan-schema';
import type { LayerRole } from './products';
import type { SiteCheck } from './site-checks';
import type { TakeoffSettings } from './settings';
import type { EavesSummary } from './eaves';

/**
 * The takeoff's own format tag; bumped whenever the stored shape changes (its zod schema is
 * shared/takeoff/takeoff-schema.ts). `/2`: strips carry `polygons` (was one `polygon`) and the
 * artefact records its product choice.
 */
export const TAKEOFF_FORMAT = 'quiltline-takeoff/4' as const;

/** `[x, y]` in plan millimetres. */
export type PlanPointMm = [number, number];

/** One cut of a strip taken from a roll lane (or from an offcut of it). Rolls and lanes count from 1. */
export interface TakeoffStripPiece {
  pieceIndex: number;
  lengthMm: number;
  /** Width cut, mm: the lane width, or less where cut lengthwise. */
  widthMm: number;
  roll: number;
  lane: number;
  /** Where the cut starts along the lane, mm (0 for a piece cut from an offcut). */
  offsetMm: number;
  /** `lane`: straight off the roll; `lengthwise`: off the roll, cut narrower; `offcut`: from an offcut (see `from`). */
  source: 'lane' | 'lengthwise' | 'offcut';
  /** For `offcut`: which one (`roll 2 lane 1 end`, `lengthwise rest of C1.9`…). */
  from?: string;
}

/** One strip of a layer: what to cut, where it lies, and where it comes from. */
export interface TakeoffStrip {
  /** Laying order within the layer, from 1. */
  number: number;
  /** Label drawn on the plan: `B7` (base) or `C1.7` (first cross layer). */
  label: string;
  /** Band the strip lies in (a bay for base layers), counting across the layer. */
  bandIndex: number;
  /**
   * Cut length, mm: the true length (an end against a sloping wall cut on the angle counts at its
   * middle) rounded up to the cutting step, a length within 1 mm of a step not rounded up.
   */
  lengthMm: number;
  /** Width cut from the roll, mm: the lane width, or the width actually covered (plus the bay's friction fit) for a narrow strip. */
  widthMm: number;
  /** Whether the strip covers its band's whole width (otherwise it is cut lengthwise). */
  fullWidth: boolean;
  /** Width of the band it fills (the bay for base layers), mm. */
  bandWidthMm: number;
  /** Extent along the band before rounding: the long side where an end is cut on the angle, mm. */
  extentMm: number;
  /** Area it covers, clipped to the layer, m². */
  areaM2: number;
  /** Area cut out of it around obstacles inside its band (kept as offcuts), m². */
  cutOutM2: number;
  /**
   * The strip's shape in plan mm (rounded to 0.1 mm): usually one polygon; several parts whose
   * union is the strip where it forks around an obstacle inside its band.
   */
  polygons: PlanPointMm[][];
  /** Where to draw the label: a point inside the strip (the middle of its largest trapezoid), plan mm. */
  labelAt: PlanPointMm;
  /** Cuts from the rolls (more than one when the strip is longer than a roll). */
  pieces: TakeoffStripPiece[];
}

/** A roll lane after packing (in a layer's `packing`, only that layer's cuts). */
export interface TakeoffLane {
  roll: number;
  lane: number;
  usedMm: number;
  leftoverMm: number;
  cuts: { stripNumber: number; pieceIndex: number; lengthMm: number; widthMm: number; offsetMm: number }[];
}

/** One cut in the per-roll cut list: strip label, which part of it (butt joints), length, width. */
export interface TakeoffCut {
  label: string;
  part: number;
  parts: number;
  lengthMm: number;
  widthMm: number;
  /** Below the lane width: cut lengthwise, the rest kept. */
  lengthwise: boolean;
}

/**
 * The cut list of one product, roll by roll: in each lane the cuts in order and what is left,
 * then the strips cut from offcuts and the slivers to fill. Rolls are pooled over the layers of
 * the space (the server pools a job's spaces with `planRolls`).
 */
export interface TakeoffRollPlan {
  productId: string;
  productName: string;
  laneWidthMm: number;
  rollLengthMm: number;
  rolls: number;
  /** ceil(area covered ÷ coverage per roll). */
  rollsLowerBound: number;
  rollsByArea: number;
  lanes: { roll: number; lane: number; cuts: TakeoffCut[]; leftoverMm: number; leftover: 'keep' | 'waste' | 'none' }[];
  fromOffcuts: { label: string; part: number; parts: number; lengthMm: number; widthMm: number; from: string }[];
  fills: { layer: string; count: number; areaM2: number }[];
  /** Offcuts worth keeping when the job is done: length × width, mm. */
  keep: { lengthMm: number; widthMm: number; from: string }[];
  wastePct: number;
}

/** One layer of the takeoff. */
export interface TakeoffLayer {
  role: LayerRole;
  /** 0 for base; 0, 1… for cross layers in laying order. */
  roleIndex: number;
  productId: string;
  productName: string;
  thicknessMm: number;
  lambda: number;
  /** Plan area the layer covers (net area minus the eaves bands), m². */
  areaM2: number;
  rollLengthMm: number;
  laneWidthMm: number;
  lanesPerRoll: number;
  coverageM2PerRoll: number;
  bandWidthMm: number;
  /** Unit vector along which strips are unrolled (towards the hatch where there is one). */
  layDirection: PlanPointMm;
  strips: TakeoffStrip[];
  /** Pieces below the minimum strip width or area: not numbered, filled from offcuts (`at`: a point inside, plan mm). */
  fills: { areaM2: number; widthMm: number; lengthMm: number; at: PlanPointMm }[];
  /** Σ strip lengths, mm. */
  totalStripLengthMm: number;
  /** Σ strip areas, m² (base layers leave the joist tops bare). */
  coveredAreaM2: number;
  /** Rolls this layer opens in the space's roll plan (offcuts of earlier layers of the product used first). */
  rollsByPacking: number;
  rollsByArea: number;
  /** ceil(covered area ÷ coverage per roll): no plan buys fewer for this layer alone. */
  rollsLowerBound: number;
  /** Bought but not laid, % of the product's rolls bought in the space (reusable offcuts included). */
  wastePct: number;
  packing: {
    method: string;
    lanesUsed: number;
    /** ceil(Σ cut area ÷ lane area): no plan uses fewer lanes for this layer. */
    lanesLowerBound: number;
    lanes: TakeoffLane[];
    offcuts: { roll: number; lane: number; lengthMm: number; widthMm: number; reusable: boolean }[];
  };
  /** rollsByPacking × price per roll, minor units. */
  priceMinor: number;
}

/** One side of the thermal comparison. */
export interface TakeoffThermalState {
  /** Depth that counts: the existing layer by its condition credit, new layers in full, mm. */
  insulationMm: number;
  rUpper: number;
  rLower: number;
  /** Total resistance surface to surface, m²K/W. */
  rTotal: number;
  /** Same, h·ft²·°F/Btu. */
  rTotalImperial: number;
  uValue: number;
  /** RdSAP 2012 Table S9 value for the same depth, for comparison. */
  rdsapU: number;
}

/** The whole takeoff (JSON-serialisable, no Infinity or NaN). */
export interface Takeoff {
  format: typeof TAKEOFF_FORMAT;
  planName: string;
  grossAreaM2: number;
  netAreaM2: number;
  excludedAreaM2: number;
  eavesBandAreaM2: number;
  /** Area new layers cover: net minus the eaves bands, m². */
  layerAreaM2: number;
  wasteAllowancePct: number;
  /** Existing insulation: typed depth, condition, depth credited for the condition and depth as it lies in the bays, mm. */
  existing: { depthMm: number; condition: string; effectiveDepthMm: number; physicalDepthMm: number; baseNeeded: boolean };
  target: Target;
  /** Products chosen for the layers: pinned in the plan, or chosen by the engine from the catalogue. */
  productChoice: { source: 'plan' | 'catalogue'; baseProductId: string | null; crossProductIds: string[] };
  layers: TakeoffLayer[];
  rollsPerProduct: { productId: string; productName: string; rollsByPacking: number; rollsByArea: number; rollsLowerBound: number; priceMinor: number }[];
  /** The cut list per product and roll (see `TakeoffRollPlan`). */
  rollPlan: TakeoffRollPlan[];
  uValueBefore: number;
  uValueAfter: number;
  /** Area-weighted U of the whole ceiling (insulated area, hatch, boards, downlights, eaves strip…) before the work, W/m²K. */
  uValueBeforeWholeCeiling: number;
  /** Same after the work, W/m²K. */
  uValueAfterWholeCeiling: number;
  rValueBeforeImperial: number;
  rValueAfterImperial: number;
  thermal: {
    before: TakeoffThermalState;
    after: TakeoffThermalState;
    method: string;
    /** Names the source of `rdsapU` (the RdSAP default, shown beside the ISO 6946 figure). */
    rdsapSource: string;
    targetUValue?: number;
    /** Which figure `meetsTarget` is judged on. */
    targetJudgedOn: 'depth' | 'whole-ceiling' | 'insulated-area';
    meetsTarget: boolean;
    /** The whole ceiling part by part (see wholeCeilingModel): areas m², U W/m²K. */
    wholeCeiling: { areaM2: number; parts: { part: string; areaM2: number; uBefore: number; uAfter: number; basis: string }[] };
    /** Extra depth of the first cross product (or 0.040 W/mK wool) over the existing layer that reaches the target U, mm. */
    depthForTargetUMm?: number | null;
  };
  savings: {
    areaM2: number;
    deltaU: number;
    heatKwhPerYear: number;
    fuelKwhPerYear: number;
    moneyMinorPerYear: number;
    degreeDays: number;
    heatingEfficiency: number;
    fuelPriceMinorPerKwh: number;
    note: string;
  };
  exclusions: {
    /** Exclusions per kind inside the outline (downlight covers, tank jackets, hatch kits…). */
    countsByKind: Record<ExclusionKind, number>;
    /** Each exclusion with its clearance and footprint (clearance included, plan mm); `insideOutline` false when it lies wholly outside and is ignored. */
    items: {
      index: number;
      kind: ExclusionKind;
      label?: string;
      /** Boarded areas: whether the boards are raised and insulated under, or left. */
      boards?: 'raise' | 'leave';
      clearanceMm: number;
      insideOutline: boolean;
      footprintAreaM2: number;
      polygons: PlanPointMm[][];
    }[];
    boardedAreaM2: number;
    /** Boarded area whose boards are raised on legs and insulated under, m². */
    raisedBoardedAreaM2: number;
  };
  eaves: EavesSummary & {
    gapMm: number;
    totalLengthMm: number;
    bands: { edgeIndex: number; edgeLengthMm: number; areaM2: number; polygon: PlanPointMm[] }[];
  };
  siteChecks: SiteCheck[];
  warnings: { code: string; message: string; edgeIndex?: number; exclusionIndex?: number; pointIndex?: number }[];
  settings: TakeoffSettings;
}
