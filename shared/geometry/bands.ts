import type { Vec2 } from './vector';
import type { Ring } from './polygon';

/**
 * Band clipping: cut a polygonal area into the pieces that fall inside parallel bands.
 *
 * Work in a strip frame (see transform.ts): bands are slabs `lo ≤ t ≤ hi` of the second
 * coordinate and pieces run along the first (`s`). Within a band, the slab is split at the ends
 * of the edges that cross it, so that each sub-slab is crossed only by straight edges; pairing
 * the crossings by x (even-odd rule) gives trapezoids, and trapezoids of neighbouring sub-slabs
 * whose shared sides overlap join into one piece (union-find). Each unbranched run of
 * trapezoids is outlined as one simple polygon, so no polygon boolean is needed. This is the
 * classic trapezoidal decomposition (de Berg et al., Computational Geometry, ch. 6) restricted
 * to the bands: O(E log E + Σ active edges × sub-slabs) for the whole layer.
 *
 * The rings must describe a region by the even-odd rule without overlaps (as polygon-clipping
 * returns: outer rings and their holes). Winding does not matter.
 */

/** A band: the slab `loMm ≤ t ≤ hiMm` in frame coordinates. */
export interface Band {
  loMm: number;
  hiMm: number;
}

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
  /**
   * The piece cut lengthwise at every sub-slab boundary: one ribbon per sub-slab `t0..t1` with the
   * mean of its left and right ends (`sLoMm`, `sHiMm`: an end cut on the angle counts at its
   * middle) and the length actually covered (`coveredMm`, less than `sHiMm − sLoMm` where the
   * piece forks around an obstacle). Ordered by `t0`.
   */
  ribbons: Ribbon[];
}

/** One sub-slab of a band piece (see `BandPiece.ribbons`), frame coordinates, mm. */
export interface Ribbon {
  t0: number;
  t1: number;
  sLoMm: number;
  sHiMm: number;
  /** The left end at `t0` and `t1`, and the right end at `t0` and `t1`. */
  lo0: number;
  lo1: number;
  hi0: number;
  hi1: number;
  coveredMm: number;
}

interface Edge {
  xa: number;
  ya: number;
  xb: number;
  yb: number;
}

interface Trap {
  y0: number;
  y1: number;
  l0: number;
  l1: number;
  r0: number;
  r1: number;
}

const EPS = 1e-7;
/**
 * Float dust, mm: two lengths (or band coordinates) closer than this are the same one. Booleans
 * snap to a micrometre grid (`BOOLEAN_GRID_MM`), so a turned plan comes back with every point a
 * fraction of a µm off: an edge drawn along the band is then a few µm out of line, and a length
 * of whole millimetres a few tenths of a µm long or short. Ten micrometres is far above that
 * grid and far below anything measured. Here sub-slab boundaries closer than this are one (an
 * edge within it of lying along the band is taken as along: it would otherwise cut a sub-slab a
 * few µm thick whose end jumps the whole edge, and that would decide how the piece is split);
 * the strips' thresholds (widths, lengths, the cutting step) give it the same benefit of doubt.
 */
export const SNAP_MM = 0.01;

// Comparators and helpers live at module level: hot loops must not create closures (a bundler's
// keep-names wrapper makes every closure creation costly, and the engine cannot inline them).
const bySMin = (p: BandPiece, q: BandPiece) => p.sMinMm - q.sMinMm;

// The lists sorted per band are short (tens of items): insertion sort beats a comparator sort.
function insertionSortNumbers(a: number[]): void {
  for (let i = 1; i < a.length; i++) {
    const v = a[i];
    let j = i - 1;
    while (j >= 0 && a[j] > v) {
      a[j + 1] = a[j];
      j--;
    }
    a[j + 1] = v;
  }
}

/** Sorts the first `n` crossings by `m`, moving `at0`/`at1` along (insertion sort: n is small). */
function sortCrossings(m: Float64Array, at0: Float64Array, at1: Float64Array, n: number): void {
  for (let i = 1; i < n; i++) {
    const vm = m[i];
    const v0 = at0[i];
    const v1 = at1[i];
    let j = i - 1;
    while (j >= 0 && m[j] > vm) {
      m[j + 1] = m[j];
      at0[j + 1] = at0[j];
      at1[j + 1] = at1[j];
      j--;
    }
    m[j + 1] = vm;
    at0[j + 1] = v0;
    at1[j + 1] = v1;
  }
}

function findRoot(parent: number[], i: number): number {
  while (parent[i] !== i) i = parent[i] = parent[parent[i]];
  return i;
}

/**
 * Pieces of the region (`rings`, frame coordinates) inside each band. Bands must be sorted by
 * `loMm` and must not overlap. Pieces smaller than `minAreaMm2` (slivers where a band grazes
 * a corner) are dropped. Output is ordered by band, then by `sMinMm`.
 */
export function clipRegionToBands(rings: Ring[], bands: Band[], minAreaMm2 = 1): BandPiece[] {
  // Bucket each edge by the first band it can reach (binary search) instead of sorting them all.
  const buckets: Edge[][] = [];
  for (let i = 0; i < bands.length; i++) buckets.push([]);
  const nb = bands.length;
  for (const ring of rings) {
    const n = ring.length;
    for (let i = 0; i < n; i++) {
      const a = ring[i];
      const b = ring[(i + 1) % n];
      if (a[1] === b[1]) continue;
      const e: Edge = a[1] < b[1] ? { xa: a[0], ya: a[1], xb: b[0], yb: b[1] } : { xa: b[0], ya: b[1], xb: a[0], yb: a[1] };
      // First band whose top lies above the edge's bottom end.
      let lo = 0;
      let hi = nb;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (bands[mid].hiMm <= e.ya) lo = mid + 1;
        else hi = mid;
      }
      if (lo < nb && bands[lo].loMm < e.yb) buckets[lo].push(e);
    }
  }
  const out: BandPiece[] = [];
  const active: Edge[] = [];
  const cuts: number[] = [];
  // Crossings of the current sub-slab in parallel typed arrays: no object per crossing.
  let cap = 64;
  let xm = new Float64Array(cap);
  let x0 = new Float64Array(cap);
  let x1 = new Float64Array(cap);
  for (let bi = 0; bi < bands.length; bi++) {
    const lo = bands[bi].loMm;
    const hi = bands[bi].hiMm;
    const bucket = buckets[bi];
    for (let k = 0; k < bucket.length; k++) active.push(bucket[k]);
    if (!(hi - lo > EPS)) continue;
    let w = 0;
    for (let k = 0; k < active.length; k++) if (active[k].yb > lo) active[w++] = active[k];
    active.length = w;
    if (w === 0) continue;
    cuts.length = 0;
    for (let k = 0; k < w; k++) {
      const e = active[k];
      if (e.ya > lo + SNAP_MM && e.ya < hi - SNAP_MM) cuts.push(e.ya);
      if (e.yb > lo + SNAP_MM && e.yb < hi - SNAP_MM) cuts.push(e.yb);
    }
    insertionSortNumbers(cuts);
    const ys = [lo];
    for (const y of cuts) if (y - ys[ys.length - 1] > SNAP_MM) ys.push(y);
    if (hi - ys[ys.length - 1] > SNAP_MM) ys.push(hi);
    else ys[ys.length - 1] = hi;
    const traps: Trap[] = [];
    const slabStart: number[] = [];
    for (let si = 0; si + 1 < ys.length; si++) {
      slabStart.push(traps.length);
      const y0 = ys[si];
      const y1 = ys[si + 1];
      const ym = (y0 + y1) / 2;
      if (w > cap) {
        cap = w * 2;
        xm = new Float64Array(cap);
        x0 = new Float64Array(cap);
        x1 = new Float64Array(cap);
      }
      let nx = 0;
      for (let k = 0; k < w; k++) {
        const e = active[k];
        if (e.ya < ym && e.yb > ym) {
          const slope = (e.xb - e.xa) / (e.yb - e.ya);
          xm[nx] = e.xa + slope * (ym - e.ya);
          x0[nx] = e.xa + slope * (Math.max(y0, e.ya) - e.ya);
          x1[nx] = e.xa + slope * (Math.min(y1, e.yb) - e.ya);
          nx++;
        }
      }
      sortCrossings(xm, x0, x1, nx);
      for (let k = 0; k + 1 < nx; k += 2) {
        traps.push({ y0, y1, l0: x0[k], l1: x1[k], r0: x0[k + 1], r1: x1[k + 1] });
      }
    }
    slabStart.push(traps.length);
    if (traps.length) bandPieces(bi, traps, slabStart, minAreaMm2, out);
  }
  return out;
}

/** Joins a band's trapezoids into pieces (union-find over overlapping neighbours) and outlines them. */
function bandPieces(bi: number, traps: Trap[], slabStart: number[], minAreaMm2: number, out: BandPiece[]): void {
  const nt = traps.length;
  const parent: number[] = [];
  const ups: number[] = [];
  const downs: number[] = [];
  const upLink: number[] = [];
  for (let i = 0; i < nt; i++) {
    parent.push(i);
    ups.push(0);
    downs.push(0);
    upLink.push(-1);
  }
  for (let si = 1; si + 1 < slabStart.length; si++) {
    for (let a = slabStart[si - 1]; a < slabStart[si]; a++) {
      for (let b = slabStart[si]; b < slabStart[si + 1]; b++) {
        const ta = traps[a];
        const tb = traps[b];
        if (Math.min(ta.r1, tb.r0) - Math.max(ta.l1, tb.l0) > EPS) {
          parent[findRoot(parent, a)] = findRoot(parent, b);
          ups[a]++;
          downs[b]++;
          upLink[a] = b;
        }
      }
    }
  }
  // Unbranched runs: a links to b when each is the other's only neighbour.
  const runNext: number[] = [];
  const hasPrev: boolean[] = [];
  for (let i = 0; i < nt; i++) {
    runNext.push(-1);
    hasPrev.push(false);
  }
  for (let a = 0; a < nt; a++) {
    const b = upLink[a];
    if (b >= 0 && ups[a] === 1 && downs[b] === 1) {
      runNext[a] = b;
      hasPrev[b] = true;
    }
  }
  const groups = new Map<number, { traps: Trap[]; runs: Trap[][] }>();
  for (let i = 0; i < nt; i++) {
    const r = findRoot(parent, i);
    let g = groups.get(r);
    if (!g) groups.set(r, (g = { traps: [], runs: [] }));
    g.traps.push(traps[i]);
    if (hasPrev[i]) continue;
    const run: Trap[] = [];
    for (let k = i; k >= 0; k = runNext[k]) run.push(traps[k]);
    g.runs.push(run);
  }
  const start = out.length;
  for (const g of groups.values()) {
    let area = 0;
    let sMin = Infinity;
    let sMax = -Infinity;
    let largest = g.traps[0];
    let largestArea = -1;
    const ribbons: Ribbon[] = [];
    let rib: Ribbon | null = null;
    for (const t of g.traps) {
      const a = ((t.r0 - t.l0 + (t.r1 - t.l1)) / 2) * (t.y1 - t.y0);
      area += a;
      // Trapezoids come slab by slab, so those of one sub-slab are consecutive.
      const lm = (t.l0 + t.l1) / 2;
      const rm = (t.r0 + t.r1) / 2;
      if (!rib || rib.t0 !== t.y0) {
        rib = { t0: t.y0, t1: t.y1, sLoMm: lm, sHiMm: rm, lo0: t.l0, lo1: t.l1, hi0: t.r0, hi1: t.r1, coveredMm: rm - lm };
        ribbons.push(rib);
      } else {
        if (lm < rib.sLoMm) {
          rib.sLoMm = lm;
          rib.lo0 = t.l0;
          rib.lo1 = t.l1;
        }
        if (rm > rib.sHiMm) {
          rib.sHiMm = rm;
          rib.hi0 = t.r0;
          rib.hi1 = t.r1;
        }
        rib.coveredMm += rm - lm;
      }
      if (a > largestArea) {
        largestArea = a;
        largest = t;
      }
      if (t.l0 < sMin) sMin = t.l0;
      if (t.l1 < sMin) sMin = t.l1;
      if (t.r0 > sMax) sMax = t.r0;
      if (t.r1 > sMax) sMax = t.r1;
    }
    if (area < minAreaMm2) continue;
    const t = largest;
    const insideAt: Vec2 = [(t.l0 + t.l1 + t.r0 + t.r1) / 4, (t.y0 + t.y1) / 2];
    out.push({ bandIndex: bi, sMinMm: sMin, sMaxMm: sMax, areaMm2: area, polygons: g.runs.map(runOutline), insideAt, ribbons });
  }
  if (out.length - start > 1) {
    const mine = out.splice(start).sort(bySMin);
    for (const p of mine) out.push(p);
  }
}

/**
 * Outline of an unbranched run (one trapezoid per consecutive sub-slab): up the left side, down
 * the right. Both ends of every side are kept: where the region steps at a sub-slab boundary (an
 * inside corner of an L), one trapezoid's top end differs from the next one's bottom end.
 */
function runOutline(g: Trap[]): Vec2[] {
  const pts: Vec2[] = [];
  for (const t of g) pts.push([t.l0, t.y0], [t.l1, t.y1]);
  for (let i = g.length - 1; i >= 0; i--) pts.push([g[i].r1, g[i].y1], [g[i].r0, g[i].y0]);
  return simplifyRing(pts);
}

/** Drop repeated and collinear points (within 1e-6 mm) in one pass; winding is made positive. */
function simplifyRing(pts: Vec2[]): Vec2[] {
  let out: Vec2[] = [];
  for (const p of pts) {
    const q = out[out.length - 1];
    if (!q || Math.abs(q[0] - p[0]) > 1e-6 || Math.abs(q[1] - p[1]) > 1e-6) out.push(p);
  }
  if (out.length > 1) {
    const a = out[0];
    const b = out[out.length - 1];
    if (Math.abs(a[0] - b[0]) <= 1e-6 && Math.abs(a[1] - b[1]) <= 1e-6) out.pop();
  }
  if (out.length > 3) {
    const keep: Vec2[] = [];
    const n = out.length;
    for (let i = 0; i < n; i++) {
      const a = keep.length ? keep[keep.length - 1] : out[n - 1];
      const b = out[i];
      const c = out[(i + 1) % n];
      const ux = b[0] - a[0];
      const uy = b[1] - a[1];
      const vx = c[0] - b[0];
      const vy = c[1] - b[1];
      const cross = ux * vy - uy * vx;
      // |cross| / (|u| + |v|) bounds the distance of b from the line a–c, give or take a factor 2.
      if (Math.abs(cross) > 1e-6 * (Math.sqrt(ux * ux + uy * uy) + Math.sqrt(vx * vx + vy * vy))) keep.push(b);
    }
    if (keep.length >= 3) out = keep;
  }
  let s = 0;
  for (let i = 0; i < out.length; i++) {
    const a = out[i];
    const b = out[(i + 1) % out.length];
    s += a[0] * b[1] - b[0] * a[1];
  }
  return s < 0 ? out.reverse() : out;
}
