import type { ExclusionKind, Plan } from '../plan/plan-schema';
import { EXCLUSION_KINDS } from '../plan/plan-schema';
import { circlePolygon, polygonBuffer } from '../geometry/offset';
import { differencePolygons, intersectPolygons } from '../geometry/boolean';
import { clipRingByConvex } from '../geometry/clip-convex';
import { ringChunks, type RingChunks } from '../geometry/ring-chunks';
import { subtractShapes } from './isolated-holes';
import { ringNearBoxes } from '../geometry/ring-near-boxes';
import {
  multiPolygonArea,
  polygonArea,
  polygonBounds,
  polygonSignedArea,
  ringWithPositiveArea,
  type MultiPolygon,
  type PolygonWithHoles,
} from '../geometry/polygon';
import type { Vec2 } from '../geometry/vector';
import type { TakeoffSettings } from './settings';

/** The planar regions of a plan, mm and mm². */
export interface PlanRegions {
  /** The outline wound with positive signed area. */
  outline: Vec2[];
  grossAreaMm2: number;
  /** Each exclusion's footprint grown by its clearance (not clipped), by exclusion index; raised boards keep theirs but are not cut out of the layers. */
  exclusionShapes: MultiPolygon[];
  /** Clearance applied to each exclusion, mm. */
  exclusionClearancesMm: number[];
  /** Area of the union of all exclusion footprints inside the outline (overlaps counted once): gross − net. */
  excludedAreaMm2: number;
  /** Outline minus the exclusions, mm². */
  netAreaMm2: number;
  /** One band per eaves edge: `eavesGapMm` wide on the inner side, clipped to the outline (exclusions not taken out); empty with eaves ventilators. */
  eavesBands: { edgeIndex: number; polygon: Vec2[]; areaMm2: number; edgeLengthMm: number }[];
  /** Net minus the eaves bands: where new layers go. */
  layerRegion: MultiPolygon;
  layerAreaMm2: number;
}

/** How this plan keeps the eaves air path open: its own choice, else the company default. */
export function eavesModeOf(plan: Plan, settings: TakeoffSettings): 'gap' | 'ventilators' {
  return plan.eavesMode ?? settings.eavesMode;
}

/** Whether an exclusion is a boarded area whose boards are raised and insulated under (so the layers run through it). */
export function isRaisedBoards(e: Plan['exclusions'][number]): boolean {
  return e.kind === 'boarded' && e.boards === 'raise';
}

/** Clearance for one exclusion: its own value, else the company default for its kind, mm. */
export function exclusionClearanceMm(e: Plan['exclusions'][number], settings: TakeoffSettings): number {
  return e.clearanceMm ?? settings.clearanceMmByKind[e.kind] ?? 0;
}

/**
 * Footprint of one exclusion with its clearance: a polygon grown outward by the clearance
 * (planar offset), or for a point (`at`) a disc of `pointFootprintRadiusMm + clearance`.
 */
export function exclusionShape(e: Plan['exclusions'][number], settings: TakeoffSettings): MultiPolygon {
  const c = exclusionClearanceMm(e, settings);
  if (e.polygon) return polygonBuffer(e.polygon, c);
  if (e.at) return [[circlePolygon(e.at, settings.pointFootprintRadiusMm + c)]];
  return [];
}

/**
 * Gross, excluded, net and layer regions of a plan. Booleans by polygon-clipping in the plane;
 * the outline may wind either way. Eaves bands are rectangles on the inner side of each eaves
 * edge (side found from the outline's winding), clipped to the outline, so a band never leaves
 * the loft even at acute corners. Overlaps between exclusions and bands are counted once.
 */
export function computePlanRegions(plan: Plan, settings: TakeoffSettings): PlanRegions {
  const outline = ringWithPositiveArea(plan.outline);
  const grossAreaMm2 = polygonArea(outline);
  const exclusionClearancesMm = plan.exclusions.map((e) => exclusionClearanceMm(e, settings));
  const exclusionShapes = plan.exclusions.map((e) => exclusionShape(e, settings));
  // Raised boards are insulated under: they keep their shape (for drawing and legs) but are not cut out.
  const allShapes = exclusionShapes.filter((_, i) => !isRaisedBoards(plan.exclusions[i])).flat();
  // ringWithPositiveArea may have reversed the ring: map plan edge indices onto it.
  const reversed = polygonSignedArea(plan.outline) < 0;
  const eavesBands: (PlanRegions['eavesBands'][number] & { rect: Vec2[] })[] = [];
  // With eaves ventilators the insulation runs over the wall plate: no band is kept back.
  const gap = eavesModeOf(plan, settings) === 'ventilators' ? 0 : plan.eavesGapMm;
  const seen = new Set<number>();
  // One outline clipped by every band: its chunks are worked out once (see clipRingByConvex).
  let chunks: RingChunks | undefined;
  for (const edgeIndex of plan.eavesEdges) {
    if (edgeIndex >= plan.outline.length || seen.has(edgeIndex)) continue;
    seen.add(edgeIndex);
    const a0 = plan.outline[edgeIndex];
    const b0 = plan.outline[(edgeIndex + 1) % plan.outline.length];
    const [a, b] = reversed ? [b0, a0] : [a0, b0];
    const dx = b[0] - a[0];
    const dy = b[1] - a[1];
    const len = Math.hypot(dx, dy);
    if (len === 0 || !(gap > 0)) {
      eavesBands.push({ edgeIndex, polygon: [], areaMm2: 0, edgeLengthMm: len, rect: [] });
      continue;
    }
    // Positive signed area: the interior lies to the +90° side of each edge direction.
    const nx = (-dy / len) * gap;
    const ny = (dx / len) * gap;
    // Not extended past the corners: at a re-entrant corner that would eat into the next room.
    const rect: Vec2[] = [
      [a[0], a[1]],
      [b[0], b[1]],
      [b[0] + nx, b[1] + ny],
      [a[0] + nx, a[1] + ny],
    ];
    const band = clipRingByConvex(outline, rect, (chunks ??= ringChunks(outline)));
    eavesBands.push({ edgeIndex, polygon: band, areaMm2: polygonArea(band), edgeLengthMm: len, rect });
  }
  const rects = eavesBands.filter((b) => b.rect.length).map((b) => [b.rect]);
  // polygon-clipping's cost grows with every vertex it sweeps: sweep once, and only what touches
  // something (see subtractShapes). Layer region = outline − (exclusions ∪ bands). The net area adds
  // back the bands' part of the loft that no exclusion covers, computed from the bands and only
  // the exclusions whose bounds touch them.
  const layerRegion =
    allShapes.length || rects.length
      ? subtractShapes(
          outline,
          allShapes,
          rects.map((r) => r[0]),
        )
      : [[outline]];
  const layerAreaMm2 = allShapes.length || rects.length ? multiPolygonArea(layerRegion) : grossAreaMm2;
  let netAreaMm2 = layerAreaMm2;
  if (rects.length) {
    const boxes = rects.map((r) => polygonBounds(r));
    // Only the outline near the bands can meet them: the sweep gets the rest as a few chords.
    const bandsInLoft = intersectPolygons([[ringNearBoxes(outline, boxes)]], rects);
    const near: PolygonWithHoles[] = [];
    for (const sh of allShapes) {
      const b = polygonBounds([sh[0]]);
      for (const r of boxes) {
        if (b.minX <= r.maxX && b.maxX >= r.minX && b.minY <= r.maxY && b.maxY >= r.minY) {
          near.push(sh);
          break;
        }
      }
    }
    netAreaMm2 += multiPolygonArea(near.length ? differencePolygons(bandsInLoft, near) : bandsInLoft);
  }
  const excludedAreaMm2 = grossAreaMm2 - netAreaMm2;
  return {
    outline,
    grossAreaMm2,
    exclusionShapes,
    exclusionClearancesMm,
    excludedAreaMm2,
    netAreaMm2,
    eavesBands: eavesBands.map(({ rect: _rect, ...b }) => b),
    layerRegion,
    layerAreaMm2,
  };
}

/**
 * How many exclusions of each kind a plan has (every kind present, zero when absent), leaving
 * out the exclusion indices in `skip` (those lying wholly outside the outline).
 */
export function countExclusionsByKind(plan: Plan, skip: ReadonlySet<number> = new Set()): Record<ExclusionKind, number> {
  const out = Object.fromEntries(EXCLUSION_KINDS.map((k) => [k, 0])) as Record<ExclusionKind, number>;
  plan.exclusions.forEach((e, i) => {
    if (!skip.has(i)) out[e.kind] += 1;
  });
  return out;
}
