import type { Plan } from '../plan/plan-schema';
import { clipRegionToBands, SNAP_MM, type Band } from '../geometry/bands';
import { fromFrame, makeStripFrame, toFrame, type StripFrame } from '../geometry/transform';
import { unitVectorFromDeg, vecPerp, type Vec2 } from '../geometry/vector';
import type { MultiPolygon } from '../geometry/polygon';
import type { LayerRole } from './products';
import { stripSegments } from './strip-segments';

/** A strip before numbering and packing: one connected piece of a layer inside one band. */
export interface RawStrip {
  bandIndex: number;
  /** Extent along the band (unrounded): the long side where an end is cut on the angle, mm. */
  extentMm: number;
  /** True length (unrounded): Σ segment lengths (an end cut on the angle counts at its middle), mm. At most `extentMm`. */
  trueLengthMm: number;
  /** Cut length: Σ segment cut lengths, mm. */
  lengthMm: number;
  /** Width across the band the piece covers at its widest, mm. */
  coveredWidthMm: number;
  /** Whether the piece covers the band's whole width (within 1 mm) somewhere. */
  fullWidth: boolean;
  /**
   * The strip along its length by covered width (see `stripSegments`): cut length (rounded up
   * to the cutting step), the width covered and whether that is the band's whole width, mm.
   */
  segments: { lengthMm: number; coveredWidthMm: number; fullWidth: boolean }[];
  /** Gaps where the piece forks around an obstacle in its band: cut out and kept, length × width across, mm. */
  cutOuts: { lengthMm: number; acrossMm: number }[];
  /** Area the strip covers (clipped to the layer), mm². */
  areaMm2: number;
  /** Frame coordinates of the piece's middle (s along the band, t across). */
  midS: number;
  midT: number;
  /** A point inside the strip, plan coordinates (see `BandPiece.insideAt`), mm. */
  insideAt: Vec2;
  /** The strip as one or more simple polygons in plan coordinates (see `BandPiece.polygons`), rounded to 0.1 mm as the takeoff shows them. */
  polygons: Vec2[][];
}

/** The bands of one layer and the frame they are laid in. */
export interface LayerBands {
  frame: StripFrame;
  bands: Band[];
  /** Width of each band, mm (the bay for base layers, the lane for cross layers). */
  bandWidthMm: number;
}

/**
 * Lay frame and bands for a layer over `region`.
 * Base: along the joists (`angleDeg`), bands are the bays between joist faces: joist centre
 * lines at `t = offsetMm + k·centres`, so a bay is `[c_k + width/2, c_{k+1} − width/2]`.
 * Cross: at right angles to the joists, bands one lane wide starting at the region's edge,
 * shifted by `staggerMm` (half a lane per extra cross layer, so joints do not line up).
 */
export function layerBands(plan: Plan, role: LayerRole, laneWidthMm: number, region: MultiPolygon, staggerMm = 0): LayerBands {
  const joist = unitVectorFromDeg(plan.joists.angleDeg);
  const frame = makeStripFrame(role === 'base' ? joist : vecPerp(joist));
  let tMin = Infinity;
  let tMax = -Infinity;
  for (const poly of region) {
    for (const p of poly[0]) {
      const t = p[0] * frame.across[0] + p[1] * frame.across[1];
      if (t < tMin) tMin = t;
      if (t > tMax) tMax = t;
    }
  }
  const bands: Band[] = [];
  if (!(tMax > tMin)) return { frame, bands, bandWidthMm: 0 };
  if (role === 'base') {
    const { centresMm: c, widthMm: w, offsetMm: o } = plan.joists;
    const k0 = Math.floor((tMin - o) / c) - 1;
    const k1 = Math.ceil((tMax - o) / c);
    for (let k = k0; k <= k1; k++) {
      const lo = o + k * c + w / 2;
      const hi = o + (k + 1) * c - w / 2;
      if (hi > tMin && lo < tMax) bands.push({ loMm: lo, hiMm: hi });
    }
    return { frame, bands, bandWidthMm: c - w };
  }
  const origin = tMin + (staggerMm % laneWidthMm) - (staggerMm > 0 ? laneWidthMm : 0);
  for (let lo = origin; lo < tMax - 1e-6; lo += laneWidthMm) bands.push({ loMm: lo, hiMm: lo + laneWidthMm });
  return { frame, bands, bandWidthMm: laneWidthMm };
}

const EDGE_TOL_MM = 1;
// `+ 0` turns -0 into 0, which JSON cannot tell apart anyway.
const r1 = (x: number) => Math.round(x * 10) / 10 + 0;

/**
 * Rounds `x` up to a multiple of `stepMm`, except that a length within `toleranceMm` above a
 * whole step stays at that step (a 4000.4 mm strip is cut at 4000 mm, not 4010 mm: no tape
 * measure reads finer than a millimetre). Step 0 leaves `x`; the result is never negative.
 */
export function roundUpToStep(x: number, stepMm: number, toleranceMm = 1): number {
  if (!(stepMm > 0)) return x;
  // The tolerance is inclusive with 10 µm to spare: booleans snap a turned plan to a micrometre
  // grid, which moves a length of whole millimetres by a few tenths of a µm either way, and that
  // must not move it across a step (801.0003 mm is cut at 800 mm, as 800.9999 mm is).
  return Math.max(0, Math.ceil((x - toleranceMm - SNAP_MM) / stepMm) * stepMm);
}

/**
 * Cuts a layer's region into strips along its bands. Each connected piece of the region in a
 * band is one strip, split along its length where its covered width changes (lengths under
 * `minSegmentMm` join the wider neighbour); each length is rounded up to `cuttingAllowanceMm`.
 * Slivers under 1 mm² (a band grazing a corner) are dropped.
 */
export function cutStrips(region: MultiPolygon, lb: LayerBands, cuttingAllowanceMm: number, minSegmentMm = 500): RawStrip[] {
  // The rings are read in the frame as they are; outline points go straight back to the plan,
  // rounded as shown (no frame copy in between either way).
  const { along, across } = lb.frame;
  const toPlan = (s: number, t: number): Vec2 => [r1(s * along[0] + t * across[0]), r1(s * along[1] + t * across[1])];
  const pieces = clipRegionToBands(region.flat(), lb.bands, 1, toPlan, lb.frame);
  return pieces.map((pc) => {
    const band = lb.bands[pc.bandIndex];
    const extentMm = pc.sMaxMm - pc.sMinMm;
    const bandWidth = band.hiMm - band.loMm;
    const { segments, gaps } = stripSegments(pc.ribbons, minSegmentMm);
    let trueLengthMm = 0;
    let lengthMm = 0;
    let coveredWidthMm = 0;
    const segs: RawStrip['segments'] = [];
    for (const g of segments) {
      const len = roundUpToStep(g.lengthMm, cuttingAllowanceMm);
      trueLengthMm += g.lengthMm;
      lengthMm += len;
      if (g.coveredWidthMm > coveredWidthMm) coveredWidthMm = g.coveredWidthMm;
      segs.push({ lengthMm: len, coveredWidthMm: g.coveredWidthMm, fullWidth: g.coveredWidthMm >= bandWidth - EDGE_TOL_MM - SNAP_MM });
    }
    return {
      bandIndex: pc.bandIndex,
      extentMm,
      trueLengthMm,
      lengthMm,
      coveredWidthMm,
      fullWidth: coveredWidthMm >= bandWidth - EDGE_TOL_MM - SNAP_MM,
      segments: segs,
      cutOuts: gaps,
      areaMm2: pc.areaMm2,
      midS: (pc.sMinMm + pc.sMaxMm) / 2,
      midT: (band.loMm + band.hiMm) / 2,
      polygons: pc.polygons,
      insideAt: fromFrame(lb.frame, pc.insideAt),
    };
  });
}

/**
 * Laying order: the strips farthest from the reference point (the access hatch, else the middle
 * of the layer) go first, so the installer works from the eaves and far walls back towards the
 * way out. Sorts by band distance, then by distance along the band; returns indices into `strips`.
 */
export function layingOrder(strips: RawStrip[], frame: StripFrame, reference: readonly number[]): number[] {
  const [rs, rt] = toFrame(frame, reference);
  return strips
    .map((s, i) => ({ i, dt: Math.abs(s.midT - rt), ds: Math.abs(s.midS - rs) }))
    .sort((a, b) => b.dt - a.dt || b.ds - a.ds || a.i - b.i)
    .map((x) => x.i);
}
