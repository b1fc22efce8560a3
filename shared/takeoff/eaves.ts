import type { Plan } from '../plan/plan-schema';
import { eavesModeOf, type PlanRegions } from './regions';
import type { TakeoffSettings } from './settings';

/** How the takeoff keeps the roof space ventilated, and what it counts for it. Lengths mm. */
export interface EavesSummary {
  mode: 'gap' | 'ventilators';
  /** Rafter centres used for the count: the plan's roof, else the joist centres, mm. */
  rafterCentresMm: number;
  /** Eaves ventilators (trays) to fit: one per rafter space along each eaves edge, ⌈length / centres⌉; 0 when the gap is kept. */
  ventilatorCount: number;
  /** Span of the roof taken as the outline's extent along the joists (ceiling joists run with the rafters), mm. */
  spanMm: number;
  /** Whether BS 5250 calls for high-level ventilation too, and why. */
  highLevel: { needed: boolean; reasons: string[] };
}

/** BS 5250:2021 cold pitched roof: high-level openings as well when the span exceeds 10 m. */
export const HIGH_LEVEL_SPAN_MM = 10_000;
/** BS 5250:2021 cold pitched roof: high-level openings as well when the pitch exceeds 35°. */
export const HIGH_LEVEL_PITCH_DEG = 35;

/**
 * The eaves and ventilation summary of a plan. Ventilators are counted per eaves edge (a part
 * space at an edge's end still takes one). High-level ventilation is called for by BS 5250:2021
 * (cold pitched roofs) when the pitch exceeds 35°, the span exceeds 10 m or the roof is
 * mono-pitch; a hipped roof has little or no ridge to vent through, so it is flagged too (common practice).
 */
export function eavesSummary(plan: Plan, s: TakeoffSettings, bands: PlanRegions['eavesBands']): EavesSummary {
  const mode = eavesModeOf(plan, s);
  const rafterCentresMm = plan.roof?.rafterCentresMm ?? plan.joists.centresMm;
  const ventilatorCount =
    mode === 'ventilators' ? bands.reduce((n, b) => n + (b.edgeLengthMm > 0 ? Math.ceil(b.edgeLengthMm / rafterCentresMm - 1e-9) : 0), 0) : 0;
  const a = (plan.joists.angleDeg * Math.PI) / 180;
  const along = plan.outline.map((p) => p[0] * Math.cos(a) + p[1] * Math.sin(a));
  const spanMm = along.length ? Math.max(...along) - Math.min(...along) : 0;
  const reasons: string[] = [];
  if (spanMm > HIGH_LEVEL_SPAN_MM) reasons.push(`the span is about ${(spanMm / 1000).toFixed(1)} m (over 10 m)`);
  if ((plan.roof?.pitchDeg ?? 0) > HIGH_LEVEL_PITCH_DEG) reasons.push(`the pitch is ${plan.roof!.pitchDeg}° (over 35°)`);
  if (plan.roof?.shape === 'mono-pitch') reasons.push('the roof is mono-pitch');
  if (plan.roof?.shape === 'hipped') reasons.push('the roof is hipped (little or no ridge to vent through)');
  return { mode, rafterCentresMm, ventilatorCount, spanMm: Math.round(spanMm * 10) / 10, highLevel: { needed: reasons.length > 0, reasons } };
}
