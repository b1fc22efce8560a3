import type { Ring } from './polygon';
import type { StripFrame } from './transform';
import { sortNumbersAscending } from './sort-numbers';
import { bandPieces, type BandPiece, type PointMap } from './band-pieces';
import { newPieceScratch, newTrapezoids, pushTrapezoid, startRibbons } from './band-scratch';

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

// Scratch columns kept from call to call, grown as needed: a typed array over 64 bytes lives
// outside the heap and costs far more to make and to collect than its size suggests, so a call
// makes none of its own (JavaScript runs one call at a time; each worker has its own module).
const W = {
  RX: new Float64Array(64),
  RY: new Float64Array(64),
  XA: new Float64Array(0),
  YA: new Float64Array(0),
  XB: new Float64Array(0),
  YB: new Float64Array(0),
  SL: new Float64Array(0),
  bucketOf: new Int32Array(0),
  bucketEdges: new Int32Array(0),
  active: new Int32Array(0),
  bucketStart: new Int32Array(0),
  bucketFill: new Int32Array(0),
  cuts: new Float64Array(64),
  xm: new Float64Array(64),
  x0: new Float64Array(64),
  x1: new Float64Array(64),
  mids: new Float64Array(64),
  slabEdgeStart: new Int32Array(64),
  slabFill: new Int32Array(64),
  slabEdges: new Int32Array(256),
  order: new Int32Array(64),
  edgeFrom: new Int32Array(64),
  edgeTo: new Int32Array(64),
  traps: newTrapezoids(),
  pieces: newPieceScratch(),
};

// Helpers live at module level: hot loops must not create closures (a bundler's keep-names
// wrapper makes every closure creation costly, and the engine cannot inline them).

/**
 * Sorts the first `n` crossings by `m`, then by edge (`ord`), moving `ord` along: the order a
 * stable sort of the crossings listed by edge gives (insertion sort: n is small and the list
 * comes nearly sorted from the last sub-slab). Only the middles move; the ends are worked out
 * afterwards in the sorted order.
 */
function sortCrossings(m: Float64Array, ord: Int32Array, n: number): void {
  for (let i = 1; i < n; i++) {
    const vm = m[i];
    const vo = ord[i];
    let j = i - 1;
    while (j >= 0 && (m[j] > vm || (m[j] === vm && ord[j] > vo))) {
      m[j + 1] = m[j];
      ord[j + 1] = ord[j];
      j--;
    }
    m[j + 1] = vm;
    ord[j + 1] = vo;
  }
}

/**
 * Pieces of the region (`rings`, frame coordinates) inside each band. Bands must be sorted by
 * `loMm` and must not overlap. Pieces smaller than `minAreaMm2` (slivers where a band grazes
 * a corner) are dropped. Output is ordered by band, then by `sMinMm`. The outlines' points are
 * `[s, t]`, or `toPoint(s, t)` when given (say, already mapped back to the plan: one array per
 * point made instead of two). With `frame`, the rings are in plan coordinates and are read in
 * that frame (`toFrame`'s arithmetic, without a copy of every point).
 */
export function clipRegionToBands(rings: Ring[], bands: Band[], minAreaMm2 = 1, toPoint?: PointMap, frame?: StripFrame): BandPiece[] {
  // Edges one column per field (objects with number fields box each number), bucketed by the
  // first band each can reach (binary search) instead of sorting them all.
  let cap0 = 0;
  for (const ring of rings) cap0 += ring.length;
  const nb = bands.length;
  if (W.XA.length < cap0) {
    const f = () => new Float64Array(2 * cap0);
    const g = () => new Int32Array(2 * cap0);
    Object.assign(W, { XA: f(), YA: f(), XB: f(), YB: f(), SL: f(), bucketOf: g(), bucketEdges: g(), active: g() });
  }
  if (W.bucketStart.length < nb + 1) {
    W.bucketStart = new Int32Array(2 * nb + 2);
    W.bucketFill = new Int32Array(2 * nb + 2);
  }
  const { XA, YA, XB, YB, SL, bucketOf, bucketStart, bucketFill, bucketEdges, active } = W;
  let ne = 0;
  let RX = W.RX;
  let RY = W.RY;
  for (const ring of rings) {
    const n = ring.length;
    if (RX.length < n) {
      RX = W.RX = new Float64Array(2 * n);
      RY = W.RY = new Float64Array(2 * n);
    }
    // The ring's points in frame coordinates (as `toFrame` gives them), one column each.
    if (frame) {
      const [a0, a1] = frame.along;
      const [c0, c1] = frame.across;
      for (let i = 0; i < n; i++) {
        const p = ring[i];
        RX[i] = p[0] * a0 + p[1] * a1;
        RY[i] = p[0] * c0 + p[1] * c1;
      }
    } else {
      for (let i = 0; i < n; i++) {
        RX[i] = ring[i][0];
        RY[i] = ring[i][1];
      }
    }
    for (let i = 0; i < n; i++) {
      const j = i + 1 < n ? i + 1 : 0;
      if (RY[i] === RY[j]) continue;
      const up = RY[i] < RY[j];
      const ai = up ? i : j;
      const bi = up ? j : i;
      const ay = RY[ai];
      const by = RY[bi];
      // First band whose top lies above the edge's bottom end.
      let lo = 0;
      let hi = nb;
      while (lo < hi) {
        const mid = (lo + hi) >> 1;
        if (bands[mid].hiMm <= ay) lo = mid + 1;
        else hi = mid;
      }
      if (!(lo < nb && bands[lo].loMm < by)) continue;
      XA[ne] = RX[ai];
      YA[ne] = ay;
      XB[ne] = RX[bi];
      YB[ne] = by;
      SL[ne] = (RX[bi] - RX[ai]) / (by - ay);
      bucketOf[ne++] = lo;
    }
  }
  // Each band's new edges in the order they were met (a counting sort keeps that order).
  bucketStart.fill(0, 0, nb + 1);
  for (let e = 0; e < ne; e++) bucketStart[bucketOf[e] + 1]++;
  for (let i = 0; i < nb; i++) bucketStart[i + 1] += bucketStart[i];
  bucketFill.set(bucketStart.subarray(0, nb));
  for (let e = 0; e < ne; e++) bucketEdges[bucketFill[bucketOf[e]]++] = e;
  let na = 0;
  const out: BandPiece[] = [];
  let cuts = W.cuts;
  const ys: number[] = [];
  const slabStart: number[] = [];
  const traps = W.traps;
  const scratch = W.pieces;
  startRibbons(scratch);
  // Crossings of the current sub-slab in parallel typed arrays: no object per crossing.
  let xm = W.xm;
  let x0 = W.x0;
  let x1 = W.x1;
  // Sub-slab middles and, per sub-slab, the edges crossing it (see below), reused band to band.
  let mids = W.mids;
  let slabEdgeStart = W.slabEdgeStart;
  let slabFill = W.slabFill;
  let slabEdges = W.slabEdges;
  let edgeFrom = W.edgeFrom;
  let edgeTo = W.edgeTo;
  let order = W.order;
  for (let bi = 0; bi < bands.length; bi++) {
    const lo = bands[bi].loMm;
    const hi = bands[bi].hiMm;
    for (let k = bucketStart[bi]; k < bucketStart[bi + 1]; k++) active[na++] = bucketEdges[k];
    if (!(hi - lo > EPS)) continue;
    let w = 0;
    for (let k = 0; k < na; k++) if (YB[active[k]] > lo) active[w++] = active[k];
    na = w;
    if (w === 0) continue;
    if (cuts.length < 2 * w) cuts = W.cuts = new Float64Array(4 * w);
    let nc = 0;
    for (let k = 0; k < w; k++) {
      const ya = YA[active[k]];
      const yb = YB[active[k]];
      // Neighbouring edges share a corner: a value just listed is not listed again, as the
      // boundaries depend only on which values there are (zeros always are: −0 sorts first).
      if (ya > lo + SNAP_MM && ya < hi - SNAP_MM && (nc === 0 || cuts[nc - 1] !== ya || ya === 0)) cuts[nc++] = ya;
      if (yb > lo + SNAP_MM && yb < hi - SNAP_MM && (nc === 0 || cuts[nc - 1] !== yb || yb === 0)) cuts[nc++] = yb;
    }
    sortNumbersAscending(cuts, 0, nc);
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
    if (mids.length < ns) mids = W.mids = new Float64Array(2 * ns);
    for (let si = 0; si < ns; si++) mids[si] = (ys[si] + ys[si + 1]) / 2;
    if (slabEdgeStart.length < ns + 1) slabEdgeStart = W.slabEdgeStart = new Int32Array(2 * ns + 2);
    if (edgeFrom.length < w) {
      edgeFrom = W.edgeFrom = new Int32Array(2 * w);
      edgeTo = W.edgeTo = new Int32Array(2 * w);
    }
    // Edges by the sub-slab they enter (in the order of `active` within each): an edge then stays
    // in the list of those crossing until its last sub-slab.
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
      if (a < z) slabEdgeStart[a + 1]++;
    }
    for (let si = 0; si < ns; si++) slabEdgeStart[si + 1] += slabEdgeStart[si];
    if (slabEdges.length < w) slabEdges = W.slabEdges = new Int32Array(2 * w);
    if (slabFill.length < ns) slabFill = W.slabFill = new Int32Array(2 * ns);
    if (order.length < w) order = W.order = new Int32Array(2 * w);
    for (let si = 0; si < ns; si++) slabFill[si] = slabEdgeStart[si];
    for (let k = 0; k < w; k++) if (edgeFrom[k] < edgeTo[k]) slabEdges[slabFill[edgeFrom[k]]++] = k;
    let no = 0;
    for (let si = 0; si < ns; si++) {
      slabStart.push(traps.n);
      const y0 = ys[si];
      const y1 = ys[si + 1];
      const ym = mids[si];
      // The last sub-slab's edges in their order across it, less those that end, then those
      // that begin here: edges do not cross inside a sub-slab, so the list is nearly sorted.
      let kept = 0;
      for (let q = 0; q < no; q++) if (edgeTo[order[q]] > si) order[kept++] = order[q];
      no = kept;
      for (let q = slabEdgeStart[si]; q < slabEdgeStart[si + 1]; q++) order[no++] = slabEdges[q];
      if (no > xm.length) {
        xm = W.xm = new Float64Array(2 * no);
        x0 = W.x0 = new Float64Array(2 * no);
        x1 = W.x1 = new Float64Array(2 * no);
      }
      for (let q = 0; q < no; q++) {
        const e = active[order[q]];
        xm[q] = XA[e] + SL[e] * (ym - YA[e]);
      }
      sortCrossings(xm, order, no);
      for (let q = 0; q < no; q++) {
        const e = active[order[q]];
        const slope = SL[e];
        const xa = XA[e];
        const ya = YA[e];
        x0[q] = xa + slope * (Math.max(y0, ya) - ya);
        x1[q] = xa + slope * (Math.min(y1, YB[e]) - ya);
      }
      for (let k = 0; k + 1 < no; k += 2) {
        pushTrapezoid(traps, y0, y1, x0[k], x1[k], x0[k + 1], x1[k + 1]);
      }
    }
    slabStart.push(traps.n);
    if (traps.n) bandPieces(bi, traps, slabStart, minAreaMm2, out, scratch, toPoint);
  }
  return out;
}
