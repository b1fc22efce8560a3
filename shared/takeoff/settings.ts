import type { ExclusionKind } from '../plan/plan-schema';

/**
 * Company settings the takeoff reads. Every default below names where it comes from; a company
 * overrides any of them (see `TakeoffOptions.settings`). Lengths in mm, resistances in m²K/W,
 * conductivities in W/mK, money in minor units (pence).
 */
export interface TakeoffSettings {
  /** Waste allowance for the rule-of-thumb roll count, percent. Default 10 (common practice: 5–10%, more for awkward lofts). */
  wasteAllowancePct: number;
  /** Strip lengths are rounded up to a multiple of this (a length within 1 mm of a step stays), mm. Default 10: a tape read to the centimetre. */
  cuttingAllowanceMm: number;
  /**
   * Minimum usable offcut length, mm: no butt-jointed piece is shorter, and only offcuts at least
   * this long are kept for other strips; shorter ends fill slivers. Default 500 (common practice:
   * a shorter length of roll does not stay butted tight and is fiddly to place between joists).
   */
  minOffcutMm: number;
  /** Narrower pieces are not cut as strips but filled from offcuts, mm. Default 100 (common practice: a hand's width). */
  minStripWidthMm: number;
  /** Smaller pieces are filled from offcuts, m². Default 0.05 (about a 250 × 200 mm piece; common practice). */
  minStripAreaM2: number;
  /** Heating degree days a year, K·day. Default 2462: UK standard year, base 15.5 °C (CIBSE TM41 degree-day convention; the 15.5 °C base already allows for typical internal and solar gains). */
  degreeDays: number;
  /** Fuel price, minor units per kWh (may have decimals). Default 6.5 p/kWh, a UK mains-gas figure from memory: set your own. */
  fuelPriceMinorPerKwh: number;
  /** Seasonal efficiency of the heating system, 0–1. Default 0.85 (condensing gas boiler, seasonal 0.85–0.90: SAP 10 Table 4b / the PCDB range; common practice). */
  heatingEfficiency: number;
  /** Resistance of the ventilated roof space above the ceiling, m²K/W, added to Rse. Default 0.2 (BS EN ISO 6946:2017 roof-space table, tiled roof with felt or boards; from memory: tested only in range checks). */
  roofSpaceResistance: number;
  /** Internal surface resistance, heat flow upward, m²K/W. Default 0.10 (BS EN ISO 6946:2017 Table 7, heat flow upward). */
  rsi: number;
  /** External surface resistance, m²K/W. Default 0.04 (BS EN ISO 6946:2017 Table 7). */
  rse: number;
  /** Ceiling board thickness, mm. Default 12.5 (the usual gypsum ceiling board; common practice). */
  ceilingBoardMm: number;
  /** Ceiling board conductivity. Default 0.21 W/mK (gypsum plasterboard, Scottish Government "Tables of U-values and thermal conductivity", Annex 6.B, 2020). */
  ceilingBoardLambda: number;
  /** Joist timber conductivity. Default 0.13 W/mK (softwood, BS EN ISO 10456:2007 Table 3). */
  timberLambda: number;
  /** Conductivity assumed for existing insulation when the plan gives none. Default 0.044 W/mK (the commonest mineral-wool loft roll's declared λ90/90, BS EN 13162 labelling; common practice). */
  existingLambda: number;
  /** Clearance kept around each exclusion kind when the exclusion gives none, mm. */
  clearanceMmByKind: Record<ExclusionKind, number>;
  /** Radius of the footprint of a point exclusion (a downlight fitting) before its clearance, mm. Default 50 (a typical 100 mm fitting; common practice). */
  pointFootprintRadiusMm: number;
  /** Share of the existing depth that still counts, by condition (Quiltline's convention, not a standard). */
  existingConditionFactor: Record<'good' | 'compressed' | 'damp' | 'patchy' | 'none', number>;
  /** Most cross layers the takeoff will propose. Default 3 (Quiltline's convention: more is rarely laid by hand). */
  maxCrossLayers: number;
  /**
   * Bays whose existing depth is within this of the joist tops count as full, so no base layer is
   * proposed, mm. Default 10 (Quiltline's convention: a shallower gap is closed by the cross layer settling).
   */
  baseFillToleranceMm: number;
  /**
   * What a U-value target is judged on: `whole-ceiling` (area-weighted over the insulated area,
   * hatch, boards, downlight covers and eaves strip, as Approved Document L judges the roof
   * element) or `insulated-area` (the insulated part only). Default `whole-ceiling`.
   */
  targetBasis: 'whole-ceiling' | 'insulated-area';
  /**
   * How the eaves air path is kept open when the plan does not say: `gap` keeps the insulation
   * back from the eaves by `eavesGapMm` (bare ceiling edge), `ventilators` fits an eaves
   * ventilator (tray) in each rafter space and runs the insulation over the wall plate (BS 5250:2021,
   * BRE BR 262). Default `gap`.
   */
  eavesMode: 'gap' | 'ventilators';
  /**
   * Insulation on the hatch lid after the work, mm (at `existingLambda`). Default 0: no credit. The
   * server sets it to the company's hatch kit depth while an active hatch kit is in its catalogue
   * (the kit the quote adds per hatch), so the U-value credits what the quote provides.
   */
  hatchInsulationMm: number;
}

/**
 * Sourced defaults for `TakeoffSettings`.
 * Clearances: downlights 100 mm unless rated for covering; masonry chimneys and metal flues 50 mm
 * (New Zealand government EnergyWise insulation guidance). In the UK follow Approved Document J and the appliance
 * maker: these are minimums, not a substitute for them.
 */
export const DEFAULT_TAKEOFF_SETTINGS: TakeoffSettings = Object.freeze({
  wasteAllowancePct: 10,
  cuttingAllowanceMm: 10,
  minOffcutMm: 500,
  minStripWidthMm: 100,
  minStripAreaM2: 0.05,
  degreeDays: 2462,
  fuelPriceMinorPerKwh: 6.5,
  heatingEfficiency: 0.85,
  roofSpaceResistance: 0.2,
  rsi: 0.1,
  rse: 0.04,
  ceilingBoardMm: 12.5,
  ceilingBoardLambda: 0.21,
  timberLambda: 0.13,
  existingLambda: 0.044,
  clearanceMmByKind: Object.freeze({ hatch: 0, tank: 0, chimney: 50, flue: 50, boarded: 0, downlight: 100, other: 0 }),
  pointFootprintRadiusMm: 50,
  existingConditionFactor: Object.freeze({ good: 1, compressed: 0.5, patchy: 0.5, damp: 0, none: 0 }),
  maxCrossLayers: 3,
  baseFillToleranceMm: 10,
  targetBasis: 'whole-ceiling',
  eavesMode: 'gap',
  hatchInsulationMm: 0,
}) as TakeoffSettings;

/** Defaults overlaid with a company's partial settings (nested records merged key by key). */
export function resolveSettings(partial?: Partial<TakeoffSettings>): TakeoffSettings {
  const d = DEFAULT_TAKEOFF_SETTINGS;
  if (!partial) return d;
  return {
    ...d,
    ...partial,
    clearanceMmByKind: { ...d.clearanceMmByKind, ...(partial.clearanceMmByKind ?? {}) },
    existingConditionFactor: { ...d.existingConditionFactor, ...(partial.existingConditionFactor ?? {}) },
  };
}
