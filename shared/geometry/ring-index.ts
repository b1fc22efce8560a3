import type { Ring } from './polygon';

/**
 * A ring's edges bucketed by height (horizontal slabs of equal height), so a question about one
 * point only looks at the edges whose height range reaches it instead of every edge: a 400-point
 * outline asked about a hundred exclusions' corners does a few thousand edge tests, not half a
 * million. Edge `k` runs from `ring[k]` to `ring[k + 1]` (the last back to the first). Each edge
 * is in every slab its height range, grown by `padMm` each way, touches; the slab of a height is
 * found by a monotone formula, so an edge whose grown range holds a height is always among that
 * height's candidates (the candidates are a superset: callers still test each one exactly).
 */
export interface RingIndex {
  ring: Ring;
  y0: number;
  /** Slab height, mm (0 when the ring is flat: one slab holds every edge). */
  h: number;
  slabs: number;
  /** Edges of slab `s` are `edges[start[s]] … edges[start[s + 1] − 1]`. */
  start: Int32Array;
  edges: Int32Array;
}

/** The slab holding height `y` (clamped to the first and last): its candidate edges are `edges[start[s]] … edges[start[s + 1] − 1]`. */
export function slabOf(ix: Pick<RingIndex, 'y0' | 'h' | 'slabs'>, y: number): number {
  if (!(ix.h > 0)) return 0;
  const s = Math.floor((y - ix.y0) / ix.h);
  return s < 0 ? 0 : s >= ix.slabs ? ix.slabs - 1 : s;
}

/** Buckets the edges of `ring`, each grown by `padMm` up and down (see `RingIndex`). */
export function indexRing(ring: Ring, padMm = 0): RingIndex {
  const n = ring.length;
  let minY = Infinity;
  let maxY = -Infinity;
  for (let i = 0; i < n; i++) {
    const y = ring[i][1];
    if (y < minY) minY = y;
    if (y > maxY) maxY = y;
  }
  const slabs = Math.max(1, n);
  const y0 = minY - padMm;
  const span = maxY + padMm - y0;
  const dims = { y0, h: n > 0 && span > 0 ? span / slabs : 0, slabs };
  const lo = new Int32Array(n);
  const hi = new Int32Array(n);
  const count = new Int32Array(slabs + 1);
  for (let k = 0; k < n; k++) {
    const a = ring[k][1];
    const b = ring[(k + 1) % n][1];
    lo[k] = slabOf(dims, (a < b ? a : b) - padMm);
    hi[k] = slabOf(dims, (a < b ? b : a) + padMm);
    for (let s = lo[k]; s <= hi[k]; s++) count[s + 1]++;
  }
  for (let s = 0; s < slabs; s++) count[s + 1] += count[s];
  const start = count.slice();
  const fill = count.slice(0, slabs);
  const edges = new Int32Array(start[slabs]);
  for (let k = 0; k < n; k++) for (let s = lo[k]; s <= hi[k]; s++) edges[fill[s]++] = k;
  return { ring, ...dims, start, edges };
}

/**
 * `polygonContainsPoint(ix.ring, p)` through the index: the same even-odd crossing test with the
 * same arithmetic on each edge, so the same answer (points on the boundary fall the same way);
 * edges that cannot straddle the point's height never toggle it and are skipped.
 */
export function indexedContainsPoint(ix: RingIndex, p: readonly number[]): boolean {
  const ring = ix.ring;
  const n = ring.length;
  const s = slabOf(ix, p[1]);
  let inside = false;
  for (let e = ix.start[s]; e < ix.start[s + 1]; e++) {
    const k = ix.edges[e];
    // As in PNPOLY: a is the later corner of the edge, b the earlier one.
    const a = ring[(k + 1) % n];
    const b = ring[k];
    if (a[1] > p[1] !== b[1] > p[1] && p[0] < ((b[0] - a[0]) * (p[1] - a[1])) / (b[1] - a[1]) + a[0]) inside = !inside;
  }
  return inside;
}
