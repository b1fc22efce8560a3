import type { ExclusionKind, Plan } from '../plan/plan-schema';
import { intersectPolygons } from '../geometry/boolean';
import { multiPolygonArea } from '../geometry/polygon';
import { indexedContainsPoint, indexRing } from '../geometry/ring-index';
import { existingInsulation } from './layers';
import { isRaisedBoards, type PlanRegions } from './regions';
import { loftCombinedMethod, type LoftThermalContext } from './thermal';
import type { TakeoffSettings } from './settings';

/** A part of the ceiling with its own build-up: the insulated area, the eaves strip, or the footprints of one exclusion kind. */
export type CeilingPartName = 'insulated' | 'eaves-strip' | ExclusionKind;

/** One part of the whole ceiling, its area (m²) and its U-value before and after the work (W/m²K). */
export interface CeilingPart {
  part: CeilingPartName;
  areaM2: number;
  uBefore: number;
  uAfter: number;
  /** What the part's U-value assumes, in words. */
  basis: string;
}

/** The ceiling split into parts, and how to turn the insulated area's U into the whole-ceiling U. */
export interface WholeCeilingModel {
  /** Gross ceiling area, m² (the sum of the parts). */
  areaM2: number;
  /** The parts with the insulated area's U left as given to `evaluate`. */
  evaluate(insulatedBefore: number, insulatedAfter: number): { parts: CeilingPart[]; uBefore: number; uAfter: number };
  /** Whole-ceiling U after the work for an insulated-area U (a straight line in it: used to judge U-value targets). */
  judgeAfter(insulatedAfter: number): number;
  /** Insulated-area U that gives the whole ceiling `target`; null when no insulation can (the other parts alone exceed it). */
  insulatedUFor(target: number): number | null;
}

const BARE = 'bare ceiling: plasterboard and surface resistances only (BS EN ISO 6946:2017 combined method)';
const EXISTING = 'what is there now, kept: no new insulation over it';

/**
 * The whole-ceiling model, the area-weighted mean U = Σ(Aᵢ·Uᵢ) / ΣAᵢ over the gross ceiling
 * (BS EN ISO 6946:2017 §6.7.1 area-weighting of elements in parallel; BRE BR 443 conventions). Parts:
 * - insulated area (the layer area: raised boards and, with eaves ventilators, the eaves strip included);
 * - eaves strip kept back by the gap: the existing layer only, no new insulation;
 * - hatch: bare before; after, bare plus `hatchInsulationMm` at `existingLambda` (0 = no credit);
 * - downlights: the fitting's footprint and clearance counted as bare ceiling (a cover is no insulation), before and after;
 * - boarded areas left boarded: the existing layer, no deeper than the joists (boards on the joists squash anything above);
 * - tanks, chimneys, flues and other exclusions: kept clear, the existing layer stays.
 * Exclusion areas are clipped to the outline and scaled to the excluded area, so overlaps are shared out
 * and the parts add up to the gross area exactly.
 */
export function wholeCeilingModel(plan: Plan, regions: PlanRegions, s: TakeoffSettings, ctx: LoftThermalContext): WholeCeilingModel {
  const u = (layers: { thicknessMm: number; lambda: number }[], c = ctx) => loftCombinedMethod(layers, c).uValue;
  const existing = existingInsulation(plan, s);
  const uBare = u([]);
  const uExisting = u(existing);
  const uBoardsLeft = u(existing.map((l) => ({ ...l, thicknessMm: Math.min(l.thicknessMm, plan.joists.depthMm) })));
  // A hatch lid has no joists: its insulation lies as one plain layer.
  const uHatchAfter = s.hatchInsulationMm > 0 ? u([{ thicknessMm: s.hatchInsulationMm, lambda: s.existingLambda }], { ...ctx, joistDepthMm: 0 }) : uBare;

  const byKind = new Map<ExclusionKind, number>();
  let sum = 0;
  // Every corner of every exclusion is tested against the outline: only the walls near its height.
  const outline = plan.exclusions.length ? indexRing(regions.outline) : null;
  plan.exclusions.forEach((e, i) => {
    if (isRaisedBoards(e)) return;
    const shape = regions.exclusionShapes[i];
    const inside = shape.every((poly) => poly[0].every((p) => indexedContainsPoint(outline!, p)));
    const a = inside ? multiPolygonArea(shape) : multiPolygonArea(intersectPolygons([[regions.outline]], shape));
    if (!(a > 0)) return;
    byKind.set(e.kind, (byKind.get(e.kind) ?? 0) + a);
    sum += a;
  });
  const scale = sum > 0 ? regions.excludedAreaMm2 / sum : 0;
  const parts: CeilingPart[] = [];
  const eavesStrip = regions.netAreaMm2 - regions.layerAreaMm2;
  if (eavesStrip > 1e-6) parts.push({ part: 'eaves-strip', areaM2: eavesStrip / 1e6, uBefore: uExisting, uAfter: uExisting, basis: EXISTING });
  for (const [kind, a] of byKind) {
    const areaM2 = (a * scale) / 1e6;
    if (kind === 'hatch')
      parts.push({
        part: kind,
        areaM2,
        uBefore: uBare,
        uAfter: uHatchAfter,
        basis: s.hatchInsulationMm > 0 ? `lid insulated with ${s.hatchInsulationMm} mm` : BARE,
      });
    else if (kind === 'downlight') parts.push({ part: kind, areaM2, uBefore: uBare, uAfter: uBare, basis: BARE });
    else if (kind === 'boarded')
      parts.push({ part: kind, areaM2, uBefore: uBoardsLeft, uAfter: uBoardsLeft, basis: 'left boarded: the existing layer up to the joist tops' });
    else parts.push({ part: kind, areaM2, uBefore: uExisting, uAfter: uExisting, basis: EXISTING });
  }
  const insulatedM2 = regions.layerAreaMm2 / 1e6;
  const areaM2 = regions.grossAreaMm2 / 1e6;
  const otherBefore = parts.reduce((t, p) => t + p.areaM2 * p.uBefore, 0);
  const otherAfter = parts.reduce((t, p) => t + p.areaM2 * p.uAfter, 0);
  const mean = (ua: number) => (areaM2 > 0 ? ua / areaM2 : 0);
  return {
    areaM2,
    evaluate(insulatedBefore, insulatedAfter) {
      const all: CeilingPart[] = [
        { part: 'insulated', areaM2: insulatedM2, uBefore: insulatedBefore, uAfter: insulatedAfter, basis: 'the insulated area (ISO 6946 combined method)' },
        ...parts,
      ];
      return { parts: all, uBefore: mean(insulatedM2 * insulatedBefore + otherBefore), uAfter: mean(insulatedM2 * insulatedAfter + otherAfter) };
    },
    judgeAfter: (insulatedAfter) => mean(insulatedM2 * insulatedAfter + otherAfter),
    insulatedUFor(target) {
      if (!(insulatedM2 > 0)) return null;
      const need = (target * areaM2 - otherAfter) / insulatedM2;
      return need > 0 ? need : null;
    },
  };
}
