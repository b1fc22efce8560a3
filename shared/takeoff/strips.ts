import type { Plan } from '../plan/plan-schema';
import { clipRegionToBands, type Band } from '../geometry/bands';
import { fromFrame, makeStripFrame, toFrame, type StripFrame } from '../geometry/transform';
import { unitVectorFromDeg, vecPerp, type Vec2 } from '../geometry/vector';
import type { MultiPolygon } from '../geometry/polygon';
import type { LayerRole } from './products';

/** A strip before numbering and packing: one connected piece of a layer inside one band. */
export interface RawStrip {
  bandIndex: number;
  /** Extent along the band (unrounded), mm. */
  extentMm: number;
  /** Cut length: the extent rounded up to the cutting allowance, mm. */
  lengthMm: number;
  /** Area the strip covers (clipped to the layer), mm². */
  areaMm2: number;
  /** Frame coordinates of the piece's middle (s along the band, t across). */
  midS: number;
  midT: number;
  /** A point inside the strip, plan coordinates (see `BandPiece.insideAt`), mm. */
  insideAt: Vec2;
  /** The strip as one or more simple polygons in plan coordinates (see `BandPiece.polygons`), mm. */
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

/** Rounds `x` up to a multiple of `stepMm` (ignoring float dust of 1e-6 mm). Step 0 leaves it. */
export function roundUpToStep(x: number, stepMm: number): number {
  if (!(stepMm > 0)) return x;
  return Math.ceil(x / stepMm - 1e-9) * stepMm;
}

/**
 * Cuts a layer's region into strips along its bands. Each connected piece of the region in a
 * band is one strip; its length is its extent along the band rounded up to `cuttingAllowanceMm`.
 * Slivers under 1 mm² (a band grazing a corner) are dropped.
 */
export function cutStrips(region: MultiPolygon, lb: LayerBands, cuttingAllowanceMm: number): RawStrip[] {
  const rings: Vec2[][] = [];
  for (const poly of region) for (const ring of poly) rings.push(ring.map((p) => toFrame(lb.frame, p)));
  const pieces = clipRegionToBands(rings, lb.bands);
  return pieces.map((pc) => {
    const band = lb.bands[pc.bandIndex];
    const extentMm = pc.sMaxMm - pc.sMinMm;
    return {
      bandIndex: pc.bandIndex,
      extentMm,
      lengthMm: roundUpToStep(extentMm, cuttingAllowanceMm),
      areaMm2: pc.areaMm2,
      midS: (pc.sMinMm + pc.sMaxMm) / 2,
      midT: (band.loMm + band.hiMm) / 2,
      polygons: pc.polygons.map((poly) => poly.map((q) => fromFrame(lb.frame, q))),
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
