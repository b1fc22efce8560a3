import type { ExclusionKind } from '../plan/plan-schema';

/**
 * Company settings the takeoff reads. Every default below names where it comes from; a company
 * overrides any of them (see `TakeoffOptions.settings`). Lengths in mm, resistances in m²K/W,
 * conductivities in W/mK, money in minor units (pence).
 */
export interface TakeoffSettings {
  /** Waste allowance for the rule-of-thumb roll count, percent. Default 10 (common practice: 5–10%, more for awkward lofts). */
  wasteAllowancePct: number;
  /** Strip lengths are rounded up to a multiple of this, mm. Default 50 (common practice). */
  cuttingAllowanceMm: number;
  /** Offcuts at least this long are kept for reuse; shorter ones are waste, mm. Default 500 (common practice). */
  minOffcutMm: number;
  /** Heating degree days a year, K·day. Default 2462: UK standard year, base 15.5 °C (published UK degree-day figure). */
  degreeDays: number;
  /** Fuel price, minor units per kWh (may have decimals). Default 6.5 p/kWh, a UK mains-gas figure from memory: set your own. */
  fuelPriceMinorPerKwh: number;
  /** Seasonal efficiency of the heating system, 0–1. Default 0.85 (condensing gas boiler 0.85–0.90, found). */
  heatingEfficiency: number;
  /** Resistance of the ventilated roof space above the ceiling, m²K/W, added to Rse. Default 0.2 (ISO 6946 roof-space table, tiled roof with felt or boards; from memory). */
  roofSpaceResistance: number;
  /** Internal surface resistance, heat flow upward, m²K/W. Default 0.10 (ISO 6946, found). */
  rsi: number;
  /** External surface resistance, m²K/W. Default 0.04 (ISO 6946, found). */
  rse: number;
  /** Ceiling board thickness, mm. Default 12.5 (gypsum plasterboard). */
  ceilingBoardMm: number;
  /** Ceiling board conductivity. Default 0.21 W/mK (gypsum plasterboard, Scottish Government Annex 6.B, found). */
  ceilingBoardLambda: number;
  /** Joist timber conductivity. Default 0.13 W/mK (softwood, ISO 10456 table, found). */
  timberLambda: number;
  /** Conductivity assumed for existing insulation when the plan gives none. Default 0.044 W/mK (the commonest mineral-wool roll, found). */
  existingLambda: number;
  /** Clearance kept around each exclusion kind when the exclusion gives none, mm. */
  clearanceMmByKind: Record<ExclusionKind, number>;
  /** Radius of the footprint of a point exclusion (a downlight fitting) before its clearance, mm. Default 50 (a typical 100 mm fitting; common practice). */
  pointFootprintRadiusMm: number;
  /** Share of the existing depth that still counts, by condition (Quiltline's convention, not a standard). */
  existingConditionFactor: Record<'good' | 'compressed' | 'damp' | 'patchy' | 'none', number>;
  /** Most cross layers the takeoff will propose. Default 3. */
  maxCrossLayers: number;
}

/**
 * Sourced defaults for `TakeoffSettings`.
 * Clearances: downlights 100 mm unless rated for covering; masonry chimneys and metal flues 50 mm
 * (New Zealand EnergyWise guidance, found). In the UK follow Approved Document J and the appliance
 * maker: these are minimums, not a substitute for them.
 */
export const DEFAULT_TAKEOFF_SETTINGS: TakeoffSettings = Object.freeze({
  wasteAllowancePct: 10,
  cuttingAllowanceMm: 50,
  minOffcutMm: 500,
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
