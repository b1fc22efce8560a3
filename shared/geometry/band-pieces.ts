import type { Vec2 } from './vector';
import { floats, ints, reserveRibbons, type PieceScratch, type Trapezoids } from './band-scratch';
import { RIBBON_COVERED, RIBBON_FIELDS, RIBBON_HI0, RIBBON_HI1, RIBBON_LO0, RIBBON_LO1, RIBBON_S_HI, RIBBON_S_LO, RIBBON_T0, RIBBON_T1 } from './ribbons';

/**
 * The second half of band clipping (see `clipRegionToBands` in bands.ts): a band's trapezoids
 * joined into pieces and outlined. Trapezoids are kept column by column in typed arrays that are
 * reused from band to band, and outlines are simplified in scratch buffers before any point is
 * made: a skewed 600 m² plan cuts some ten thousand trapezoids per layer, and one small array
 * per corner of each was most of the garbage of a takeoff.
 */

/** One connected piece of the region inside one band, in frame coordinates. */
export interface BandPiece {
  /** Index into the bands array passed in. */
  bandIndex: number;
  /** Extent along the band: the piece spans `sMinMm..sMaxMm`. */
  sMinMm: number;
  sMaxMm: number;
  /** Exact area of the piece, mm². */
  areaMm2: number;
  /**
   * The piece as one or more simple polygons in frame coordinates (positive signed area) whose
   * union is the piece: one for a plain run, more where the piece forks around an obstacle
   * inside the band (each unbranched run of trapezoids becomes one part).
   */
  polygons: Vec2[][];
  /**
   * A point inside the piece, frame coordinates: the middle of its largest trapezoid. Unlike the
   * middle of the extent it never falls in a hole, outside a partly covered band or in a notch.
   */
  insideAt: Vec2;
  /** The piece cut lengthwise at every sub-slab boundary: its ribbons (see ribbons.ts), ordered by `t0`. */
  ribbons: Float64Array;
}

/** Makes an outline's point from its frame coordinates (`s` along the band, `t` across). */
export type PointMap = (s: number, t: number) => Vec2;

const EPS = 1e-7;

function findRoot(parent: Int32Array, i: number): number {
  while (parent[i] !== i) i = parent[i] = parent[parent[i]];
  return i;
}

/**
 * Joins a band's trapezoids into pieces (union-find over overlapping neighbours in consecutive
 * sub-slabs; `slabStart[s]` is the first trapezoid of sub-slab `s`, `slabStart[slabs]` the count)
 * and outlines them, each outline point made by `toPoint` when given. Pieces under `minAreaMm2` are dropped; the rest are appended to `out` in
 * order of `sMinMm` (ties in the order their first trapezoid was cut).
 */
export function bandPieces(bi: number, T: Trapezoids, slabStart: number[], minAreaMm2: number, out: BandPiece[], S: PieceScratch, toPoint?: PointMap): void {
  const nt = T.n;
  // The columns as locals: loads of an object's fields are not hoisted out of loops that store to typed arrays.
  const { y0: Y0, y1: Y1, l0: L0, l1: L1, r0: R0, r1: R1 } = T;
  const parent = ints(S, 0, nt);
  const ups = ints(S, 1, nt);
  const downs = ints(S, 2, nt);
  const upLink = ints(S, 3, nt);
  for (let i = 0; i < nt; i++) {
    parent[i] = i;
    ups[i] = 0;
    downs[i] = 0;
    upLink[i] = -1;
  }
  // Bounds on the lower sides of a sub-slab's trapezoids (running maximum of the right ends,
  // running minimum from the end of the left ends): a top side meets only the lower sides between
  // the first whose running maximum passes its left end and the last whose running minimum is
  // short of its right end, so a sub-slab crossed by many holes is not tested pair by pair.
  // Which pairs join, and in which order, is as a test of every pair would find.
  const maxR = floats(S, 0, nt);
  const minL = floats(S, 1, nt);
  for (let si = 1; si + 1 < slabStart.length; si++) {
    const b0 = slabStart[si];
    const b1 = slabStart[si + 1];
    const wide = (slabStart[si] - slabStart[si - 1]) * (b1 - b0) > 16;
    if (wide) {
      let hiR = -Infinity;
      for (let b = b0; b < b1; b++) {
        if (R0[b] > hiR) hiR = R0[b];
        maxR[b] = hiR;
      }
      let loL = Infinity;
      for (let b = b1 - 1; b >= b0; b--) {
        if (L0[b] < loL) loL = L0[b];
        minL[b] = loL;
      }
    }
    for (let a = slabStart[si - 1]; a < slabStart[si]; a++) {
      let from = b0;
      let to = b1;
      if (wide) {
        // First lower side whose running maximum of right ends exceeds a's left end.
        const la = L1[a];
        let x = b0;
        let y = b1;
        while (x < y) {
          const mid = (x + y) >> 1;
          if (maxR[mid] > la) y = mid;
          else x = mid + 1;
        }
        from = x;
        // Past the last lower side whose running minimum of left ends is short of a's right end.
        const ra = R1[a];
        x = from;
        y = b1;
        while (x < y) {
          const mid = (x + y) >> 1;
          if (minL[mid] < ra) x = mid + 1;
          else y = mid;
        }
        to = x;
      }
      for (let b = from; b < to; b++) {
        if (Math.min(R1[a], R0[b]) - Math.max(L1[a], L0[b]) > EPS) {
          // The newer trapezoid joins the older one's set: trees stay flat up a run (linking the
          // other way makes a chain as long as the run). Pieces are numbered by their first
          // trapezoid, whichever is the root.
          parent[findRoot(parent, b)] = findRoot(parent, a);
          ups[a]++;
          downs[b]++;
          upLink[a] = b;
        }
      }
    }
  }
  // Unbranched runs: a links to b when each is the other's only neighbour.
  const runNext = ints(S, 4, nt);
  const hasPrev = ints(S, 5, nt);
  for (let i = 0; i < nt; i++) {
    runNext[i] = -1;
    hasPrev[i] = 0;
  }
  for (let a = 0; a < nt; a++) {
    const b = upLink[a];
    if (b >= 0 && ups[a] === 1 && downs[b] === 1) {
      runNext[a] = b;
      hasPrev[b] = 1;
    }
  }
  // Pieces numbered in the order of their first trapezoid; each piece's trapezoids in cutting order.
  const groupOfRoot = ints(S, 6, nt);
  const groupOf = ints(S, 7, nt);
  for (let i = 0; i < nt; i++) groupOfRoot[i] = -1;
  let ng = 0;
  for (let i = 0; i < nt; i++) {
    const r = findRoot(parent, i);
    if (groupOfRoot[r] < 0) groupOfRoot[r] = ng++;
    groupOf[i] = groupOfRoot[r];
  }
  const first = ints(S, 8, ng + 1);
  for (let g = 0; g <= ng; g++) first[g] = 0;
  for (let i = 0; i < nt; i++) first[groupOf[i] + 1]++;
  for (let g = 0; g < ng; g++) first[g + 1] += first[g];
  const fill = ints(S, 9, ng);
  for (let g = 0; g < ng; g++) fill[g] = first[g];
  const members = ints(S, 10, nt);
  for (let i = 0; i < nt; i++) members[fill[groupOf[i]]++] = i;

  const start = out.length;
  for (let g = 0; g < ng; g++) {
    let area = 0;
    let sMin = Infinity;
    let sMax = -Infinity;
    let largest = members[first[g]];
    let largestArea = -1;
    // Ribbons: trapezoids come slab by slab, so those of one sub-slab are consecutive.
    let nr = 0;
    let lastY0 = 0;
    for (let m = first[g]; m < first[g + 1]; m++) {
      const y0 = Y0[members[m]];
      if (nr === 0 || lastY0 !== y0) {
        nr++;
        lastY0 = y0;
      }
    }
    // A view into a chunk shared by the pieces of one call (see `PieceScratch.ribbons`).
    const need = nr * RIBBON_FIELDS;
    reserveRibbons(S, need);
    const ribbons = S.ribbons.subarray(S.ribbonsUsed, S.ribbonsUsed + need);
    S.ribbonsUsed += need;
    let o = -RIBBON_FIELDS;
    for (let m = first[g]; m < first[g + 1]; m++) {
      const t = members[m];
      const y0 = Y0[t];
      const l0 = L0[t];
      const l1 = L1[t];
      const r0 = R0[t];
      const r1 = R1[t];
      const a = ((r0 - l0 + (r1 - l1)) / 2) * (Y1[t] - y0);
      area += a;
      const lm = (l0 + l1) / 2;
      const rm = (r0 + r1) / 2;
      if (o < 0 || ribbons[o + RIBBON_T0] !== y0) {
        o += RIBBON_FIELDS;
        ribbons[o + RIBBON_T0] = y0;
        ribbons[o + RIBBON_T1] = Y1[t];
        ribbons[o + RIBBON_S_LO] = lm;
        ribbons[o + RIBBON_S_HI] = rm;
        ribbons[o + RIBBON_LO0] = l0;
        ribbons[o + RIBBON_LO1] = l1;
        ribbons[o + RIBBON_HI0] = r0;
        ribbons[o + RIBBON_HI1] = r1;
        ribbons[o + RIBBON_COVERED] = rm - lm;
      } else {
        if (lm < ribbons[o + RIBBON_S_LO]) {
          ribbons[o + RIBBON_S_LO] = lm;
          ribbons[o + RIBBON_LO0] = l0;
          ribbons[o + RIBBON_LO1] = l1;
        }
        if (rm > ribbons[o + RIBBON_S_HI]) {
          ribbons[o + RIBBON_S_HI] = rm;
          ribbons[o + RIBBON_HI0] = r0;
          ribbons[o + RIBBON_HI1] = r1;
        }
        ribbons[o + RIBBON_COVERED] += rm - lm;
      }
      if (a > largestArea) {
        largestArea = a;
        largest = t;
      }
      if (l0 < sMin) sMin = l0;
      if (l1 < sMin) sMin = l1;
      if (r0 > sMax) sMax = r0;
      if (r1 > sMax) sMax = r1;
    }
    if (area < minAreaMm2) continue;
    const polygons: Vec2[][] = [];
    for (let m = first[g]; m < first[g + 1]; m++) if (!hasPrev[members[m]]) polygons.push(runOutline(T, runNext, members[m], S, toPoint));
    const t = largest;
    const insideAt: Vec2 = [(L0[t] + L1[t] + R0[t] + R1[t]) / 4, (Y0[t] + Y1[t]) / 2];
    out.push({ bandIndex: bi, sMinMm: sMin, sMaxMm: sMax, areaMm2: area, polygons, insideAt, ribbons });
  }
  if (out.length - start > 1) {
    const mine = out.splice(start).sort(bySMin);
    for (const p of mine) out.push(p);
  }
}

const bySMin = (p: BandPiece, q: BandPiece) => p.sMinMm - q.sMinMm;

/**
 * Outline of the unbranched run starting at trapezoid `head` (one trapezoid per consecutive
 * sub-slab, linked by `runNext`): up the left side, down the right. Both ends of every side are
 * kept: where the region steps at a sub-slab boundary (an inside corner of an L), one
 * trapezoid's top end differs from the next one's bottom end. Repeated and collinear points
 * (within 1e-6 mm) are dropped in one pass; winding is made positive.
 */
function runOutline(T: Trapezoids, runNext: Int32Array, head: number, S: PieceScratch, toPoint: PointMap | undefined): Vec2[] {
  let len = 0;
  for (let k = head; k >= 0; k = runNext[k]) len++;
  if (S.xs.length < 4 * len) {
    S.xs = new Float64Array(8 * len);
    S.ys = new Float64Array(8 * len);
    S.keep = new Int32Array(8 * len);
  }
  const xs = S.xs;
  const ys = S.ys;
  const { y0: Y0, y1: Y1, l0: L0, l1: L1, r0: R0, r1: R1 } = T;
  // Corners as they come (up the left, down the right), dropping each that repeats the last kept.
  let m = 0;
  const run = ints(S, 11, len);
  let c = 0;
  for (let k = head; k >= 0; k = runNext[k]) {
    run[c++] = k;
    m = putCorner(xs, ys, m, L0[k], Y0[k]);
    m = putCorner(xs, ys, m, L1[k], Y1[k]);
  }
  for (let i = len - 1; i >= 0; i--) {
    const k = run[i];
    m = putCorner(xs, ys, m, R1[k], Y1[k]);
    m = putCorner(xs, ys, m, R0[k], Y0[k]);
  }
  if (m > 1 && Math.abs(xs[0] - xs[m - 1]) <= 1e-6 && Math.abs(ys[0] - ys[m - 1]) <= 1e-6) m--;
  // Indices of the corners kept: all of them, or those off the line through their neighbours.
  const keep = S.keep;
  let nk = 0;
  if (m > 3) {
    for (let i = 0; i < m; i++) {
      const a = nk ? keep[nk - 1] : m - 1;
      const j = i + 1 < m ? i + 1 : 0;
      const ux = xs[i] - xs[a];
      const uy = ys[i] - ys[a];
      const vx = xs[j] - xs[i];
      const vy = ys[j] - ys[i];
      const cross = Math.abs(ux * vy - uy * vx);
      // |cross| / (|u| + |v|) bounds the distance of b from the line a–c, give or take a factor 2.
      // A length lies between its largest coordinate and their sum: the square roots are taken
      // only when |cross| falls between the bounds these give (with room for rounding), so the
      // answer is the one the exact test gives.
      const au = Math.abs(ux);
      const bu = Math.abs(uy);
      const av = Math.abs(vx);
      const bv = Math.abs(vy);
      if (cross > 1e-6 * (au + bu + av + bv) * (1 + 1e-9)) keep[nk++] = i;
      else if (cross <= 1e-6 * ((au > bu ? au : bu) + (av > bv ? av : bv)) * (1 - 1e-9)) continue;
      else if (cross > 1e-6 * (Math.sqrt(ux * ux + uy * uy) + Math.sqrt(vx * vx + vy * vy))) keep[nk++] = i;
    }
  }
  if (nk < 3) {
    nk = m;
    for (let i = 0; i < m; i++) keep[i] = i;
  }
  let s = 0;
  for (let i = 0; i < nk; i++) {
    const a = keep[i];
    const b = keep[i + 1 < nk ? i + 1 : 0];
    s += xs[a] * ys[b] - xs[b] * ys[a];
  }
  const pts: Vec2[] = new Array(nk);
  for (let i = 0; i < nk; i++) {
    const k = keep[s < 0 ? nk - 1 - i : i];
    pts[i] = toPoint ? toPoint(xs[k], ys[k]) : [xs[k], ys[k]];
  }
  return pts;
}

/** Appends corner (x, y) after the first `m` unless it repeats the last (within 1e-6 mm); returns the new count. */
function putCorner(xs: Float64Array, ys: Float64Array, m: number, x: number, y: number): number {
  if (m === 0 || Math.abs(xs[m - 1] - x) > 1e-6 || Math.abs(ys[m - 1] - y) > 1e-6) {
    xs[m] = x;
    ys[m] = y;
    return m + 1;
  }
  return m;
}
