import type { Ring } from './polygon';
import { bandPieces, newPieceScratch, newTrapezoids, pushTrapezoid, type BandPiece, type PointMap } from './band-pieces';

export type { BandPiece, PointMap } from './band-pieces';

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

// Helpers live at module level: hot loops must not create closures (a bundler's keep-names
// wrapper makes every closure creation costly, and the engine cannot inline them).

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

/**
 * Sorts the first `n` values ascending, −0 before 0 as a typed array's sort puts them. A band
 * usually holds a few dozen edge ends, for which insertion sort beats a native sort's set-up.
 */
function sortCuts(a: Float64Array, n: number): void {
  if (n > 64) {
    a.subarray(0, n).sort();
    return;
  }
  for (let i = 1; i < n; i++) {
    const v = a[i];
    let j = i - 1;
    while (j >= 0 && (a[j] > v || (a[j] === 0 && v === 0 && 1 / a[j] > 1 / v))) {
      a[j + 1] = a[j];
      j--;
    }
    a[j + 1] = v;
  }
}

/**
 * Pieces of the region (`rings`, frame coordinates) inside each band. Bands must be sorted by
 * `loMm` and must not overlap. Pieces smaller than `minAreaMm2` (slivers where a band grazes
 * a corner) are dropped. Output is ordered by band, then by `sMinMm`. The outlines' points are
 * `[s, t]`, or `toPoint(s, t)` when given (say, already mapped back to the plan: one array per
 * point made instead of two).
 */
export function clipRegionToBands(rings: Ring[], bands: Band[], minAreaMm2 = 1, toPoint?: PointMap): BandPiece[] {
  // Edges one column per field (objects with number fields box each number), bucketed by the
  // first band each can reach (binary search) instead of sorting them all.
  let cap0 = 0;
  for (const ring of rings) cap0 += ring.length;
  const XA = new Float64Array(cap0);
  const YA = new Float64Array(cap0);
  const XB = new Float64Array(cap0);
  const YB = new Float64Array(cap0);
  const SL = new Float64Array(cap0);
  const bucketOf = new Int32Array(cap0);
  let ne = 0;
  const nb = bands.length;
  for (const ring of rings) {
    const n = ring.length;
    for (let i = 0; i < n; i++) {
      const p = ring[i];
      const q = ring[(i + 1) % n];
      if (p[1] === q[1]) continue;
      const up = p[1] < q[1];
      const a = up ? p : q;
      const b = up ? q : p;
      // First band whose top lies above the edge's bottom end.
      let lo = 0;
      let hi = nb;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (bands[mid].hiMm <= a[1]) lo = mid + 1;
        else hi = mid;
      }
      if (!(lo < nb && bands[lo].loMm < b[1])) continue;
      XA[ne] = a[0];
      YA[ne] = a[1];
      XB[ne] = b[0];
      YB[ne] = b[1];
      SL[ne] = (b[0] - a[0]) / (b[1] - a[1]);
      bucketOf[ne++] = lo;
    }
  }
  // Each band's new edges in the order they were met (a counting sort keeps that order).
  const bucketStart = new Int32Array(nb + 1);
  for (let e = 0; e < ne; e++) bucketStart[bucketOf[e] + 1]++;
  for (let i = 0; i < nb; i++) bucketStart[i + 1] += bucketStart[i];
  const bucketFill = bucketStart.slice(0, nb);
  const bucketEdges = new Int32Array(ne);
  for (let e = 0; e < ne; e++) bucketEdges[bucketFill[bucketOf[e]]++] = e;
  const active = new Int32Array(ne);
  let na = 0;
  const out: BandPiece[] = [];
  let cuts = new Float64Array(64);
  const ys: number[] = [];
  const slabStart: number[] = [];
  const traps = newTrapezoids();
  const scratch = newPieceScratch();
  // Crossings of the current sub-slab in parallel typed arrays: no object per crossing.
  let cap = 64;
  let xm = new Float64Array(cap);
  let x0 = new Float64Array(cap);
  let x1 = new Float64Array(cap);
  // Sub-slab middles and, per sub-slab, the edges crossing it (see below), reused band to band.
  let mids = new Float64Array(64);
  let slabEdgeStart = new Int32Array(64);
  let slabFill = new Int32Array(64);
  let slabEdges = new Int32Array(256);
  let edgeFrom = new Int32Array(64);
  let edgeTo = new Int32Array(64);
  for (let bi = 0; bi < bands.length; bi++) {
    const lo = bands[bi].loMm;
    const hi = bands[bi].hiMm;
    for (let k = bucketStart[bi]; k < bucketStart[bi + 1]; k++) active[na++] = bucketEdges[k];
    if (!(hi - lo > EPS)) continue;
    let w = 0;
    for (let k = 0; k < na; k++) if (YB[active[k]] > lo) active[w++] = active[k];
    na = w;
    if (w === 0) continue;
    if (cuts.length < 2 * w) cuts = new Float64Array(4 * w);
    let nc = 0;
    for (let k = 0; k < w; k++) {
      const ya = YA[active[k]];
      const yb = YB[active[k]];
      if (ya > lo + SNAP_MM && ya < hi - SNAP_MM) cuts[nc++] = ya;
      if (yb > lo + SNAP_MM && yb < hi - SNAP_MM) cuts[nc++] = yb;
    }
    sortCuts(cuts, nc);
    ys.length = 0;
    ys.push(lo);
    for (let k = 0; k < nc; k++) if (cuts[k] - ys[ys.length - 1] > SNAP_MM) ys.push(cuts[k]);
    if (hi - ys[ys.length - 1] > SNAP_MM) ys.push(hi);
    else ys[ys.length - 1] = hi;
    traps.n = 0;
    slabStart.length = 0;
    // Each edge crosses the middles of a run of sub-slabs: list it under each of them (in the
    // order of `active`, as a scan of every edge per sub-slab would meet them), so a sub-slab
    // looks only at the edges that cross it.
    const ns = ys.length - 1;
    if (mids.length < ns) mids = new Float64Array(2 * ns);
    for (let si = 0; si < ns; si++) mids[si] = (ys[si] + ys[si + 1]) / 2;
    if (slabEdgeStart.length < ns + 1) slabEdgeStart = new Int32Array(2 * ns + 2);
    if (edgeFrom.length < w) {
      edgeFrom = new Int32Array(2 * w);
      edgeTo = new Int32Array(2 * w);
    }
    for (let si = 0; si <= ns; si++) slabEdgeStart[si] = 0;
    for (let k = 0; k < w; k++) {
      const ya = YA[active[k]];
      const yb = YB[active[k]];
      // First sub-slab whose middle lies above the edge's lower end, then those below its upper end.
      let a = 0;
      let b = ns;
      while (a < b) {
        const mid = (a + b) >> 1;
        if (mids[mid] > ya) b = mid;
        else a = mid + 1;
      }
      let z = a;
      while (z < ns && mids[z] < yb) z++;
      edgeFrom[k] = a;
      edgeTo[k] = z;
      for (let si = a; si < z; si++) slabEdgeStart[si + 1]++;
    }
    for (let si = 0; si < ns; si++) slabEdgeStart[si + 1] += slabEdgeStart[si];
    const total = slabEdgeStart[ns];
    if (slabEdges.length < total) slabEdges = new Int32Array(2 * total);
    if (slabFill.length < ns) slabFill = new Int32Array(2 * ns);
    for (let si = 0; si < ns; si++) slabFill[si] = slabEdgeStart[si];
    for (let k = 0; k < w; k++) for (let si = edgeFrom[k]; si < edgeTo[k]; si++) slabEdges[slabFill[si]++] = k;
    for (let si = 0; si < ns; si++) {
      slabStart.push(traps.n);
      const y0 = ys[si];
      const y1 = ys[si + 1];
      const ym = mids[si];
      const n = slabEdgeStart[si + 1] - slabEdgeStart[si];
      if (n > cap) {
        cap = n * 2;
        xm = new Float64Array(cap);
        x0 = new Float64Array(cap);
        x1 = new Float64Array(cap);
      }
      let nx = 0;
      for (let q = slabEdgeStart[si]; q < slabEdgeStart[si + 1]; q++) {
        const e = active[slabEdges[q]];
        const slope = SL[e];
        const xa = XA[e];
        const ya = YA[e];
        xm[nx] = xa + slope * (ym - ya);
        x0[nx] = xa + slope * (Math.max(y0, ya) - ya);
        x1[nx] = xa + slope * (Math.min(y1, YB[e]) - ya);
        nx++;
      }
      sortCrossings(xm, x0, x1, nx);
      for (let k = 0; k + 1 < nx; k += 2) {
        pushTrapezoid(traps, y0, y1, x0[k], x1[k], x0[k + 1], x1[k + 1]);
      }
    }
    slabStart.push(traps.n);
    if (traps.n) bandPieces(bi, traps, slabStart, minAreaMm2, out, scratch, toPoint);
  }
  return out;
}
