import { polygonContainsPoint, type Ring } from './polygon';
import { segmentIntersection } from './segment';
import type { Vec2 } from './vector';

/** Axis-aligned bounds, mm. */
export interface Box {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/**
 * Clearances, mm: an edge whose bounds come within `EDGE_CLEARANCE_MM` of a box is kept as it
 * is, and a chord keeps `CHORD_CLEARANCE_MM` from every box. Both are far beyond anything the
 * booleans' micrometre grid or tolerances reach, so the sweep meets the part of the ring near
 * the boxes exactly as before; the edge clearance is the larger so that a chord, which starts a
 * metre from any box and heads away from the ring, still finds room.
 */
const EDGE_CLEARANCE_MM = 1000;
const CHORD_CLEARANCE_MM = 100;

const grown = (b: Box, d: number): Box => ({ minX: b.minX - d, minY: b.minY - d, maxX: b.maxX + d, maxY: b.maxY + d });

/** Whether segment `p–q` meets box `b` (separating axes: the box's two and the segment's normal). */
function segmentMeetsBox(p: Vec2, q: Vec2, b: Box): boolean {
  if (Math.max(p[0], q[0]) < b.minX || Math.min(p[0], q[0]) > b.maxX || Math.max(p[1], q[1]) < b.minY || Math.min(p[1], q[1]) > b.maxY) return false;
  const dx = q[0] - p[0];
  const dy = q[1] - p[1];
  // The corners' sides of the segment's line: the box is clear of it when all four lie strictly on one side.
  const c0 = dx * (b.minY - p[1]) - dy * (b.minX - p[0]);
  const c1 = dx * (b.minY - p[1]) - dy * (b.maxX - p[0]);
  const c2 = dx * (b.maxY - p[1]) - dy * (b.maxX - p[0]);
  const c3 = dx * (b.maxY - p[1]) - dy * (b.minX - p[0]);
  return !((c0 > 0 && c1 > 0 && c2 > 0 && c3 > 0) || (c0 < 0 && c1 < 0 && c2 < 0 && c3 < 0));
}

/**
 * The simple ring `ring` with every run of edges that passes nowhere near the boxes replaced by
 * one chord from the run's first point to its last, for a boolean whose result lies within the
 * boxes (the outline ∩ the eaves bands): polygon-clipping's cost grows with every vertex it
 * sweeps, and a long outline usually has eaves along only part of it. A chord is taken only
 * where the result cannot change: it keeps its clearance from every box and touches no other
 * edge, and the region between the run and its chord holds no box and no other part of the
 * ring. Points are the ring's own (a subsequence, point 0 kept first), so every edge near the
 * boxes reaches the sweep as before, in the same order.
 */
export function ringNearBoxes(ring: Ring, boxes: Box[]): Vec2[] {
  const n = ring.length;
  const near = boxes.map((b) => grown(b, EDGE_CLEARANCE_MM));
  const clear = boxes.map((b) => grown(b, CHORD_CLEARANCE_MM));
  // A box that an edge reaches within the chord clearance cannot lie between a run and its
  // chord (neither comes that close to it, and that edge is kept, outside): only the others are tested.
  const reached = new Uint8Array(boxes.length);
  // The grown boxes by their left side, so an edge looks only at those that start within one
  // box width of it.
  const order = near.map((_, i) => i).sort((i, j) => near[i].minX - near[j].minX);
  const lefts = order.map((i) => near[i].minX);
  const widest = near.reduce((w, b) => Math.max(w, b.maxX - b.minX), 0);
  const far = new Uint8Array(n);
  for (let k = 0; k < n; k++) {
    const p = ring[k] as Vec2;
    const q = ring[k + 1 < n ? k + 1 : 0] as Vec2;
    const x0 = Math.min(p[0], q[0]);
    const x1 = Math.max(p[0], q[0]);
    const y0 = Math.min(p[1], q[1]);
    const y1 = Math.max(p[1], q[1]);
    far[k] = 1;
    let lo = 0;
    let hi = lefts.length;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (lefts[mid] < x0 - widest) lo = mid + 1;
      else hi = mid;
    }
    for (let o = lo; o < order.length && lefts[o] <= x1; o++) {
      const i = order[o];
      const b = near[i];
      if (x0 <= b.maxX && x1 >= b.minX && y0 <= b.maxY && y1 >= b.minY) {
        far[k] = 0;
        if (!reached[i] && segmentMeetsBox(p, q, clear[i])) reached[i] = 1;
      }
    }
  }
  const unreached = boxes.filter((_, i) => !reached[i]);
  const drop = new Uint8Array(n);
  const chords: [Vec2, Vec2][] = [];
  let dropped = 0;
  // Runs of far edges s..t−1 (from point s to point t, t = n meaning point 0), never through point 0.
  for (let s = 0; s < n;) {
    if (!far[s]) {
      s++;
      continue;
    }
    let t = s;
    while (t < n && far[t]) t++;
    if (t - s >= 2 && n - (t - s) >= 2 && chordIsSafe(ring, s, t, clear, unreached, chords)) {
      for (let k = s + 1; k < t; k++) drop[k] = 1;
      dropped += t - s - 1;
      chords.push([ring[s] as Vec2, ring[t % n] as Vec2]);
    }
    s = t;
  }
  if (!dropped) return ring as Vec2[];
  const out: Vec2[] = [];
  for (let k = 0; k < n; k++) if (!drop[k]) out.push(ring[k] as Vec2);
  return out;
}

/** Whether the chord from point `s` to point `t` (mod n) may stand for the edges between them (see `ringNearBoxes`). */
function chordIsSafe(ring: Ring, s: number, t: number, clear: Box[], unreached: Box[], chords: [Vec2, Vec2][]): boolean {
  const n = ring.length;
  const a = ring[s] as Vec2;
  const b = ring[t % n] as Vec2;
  const dx = b[0] - a[0];
  const dy = b[1] - a[1];
  const len = Math.hypot(dx, dy);
  if (len === 0) return false;
  if (clear.some((bx) => segmentMeetsBox(a, b, bx))) return false;
  // Signed distance of a point from the chord's line: an edge with both ends more than the
  // tolerance to one side cannot touch the chord.
  const side = (p: readonly number[]) => (dx * (p[1] - a[1]) - dy * (p[0] - a[0])) / len;
  // The edges outside the run: the two beside the chord share only its end points (not collinear
  // with it), the rest do not touch it at all.
  const before = (s - 1 + n) % n;
  const after = t % n;
  for (let k = 0; k < n; k++) {
    if (k >= s && k < t) continue;
    const p = ring[k];
    const q = ring[k + 1 < n ? k + 1 : 0];
    if (k === before || k === after) {
      const other = k === before ? p : q;
      if (Math.abs(side(other)) <= 1e-6 * Math.hypot(other[0] - a[0], other[1] - a[1])) return false;
      continue;
    }
    const sp = side(p);
    const sq = side(q);
    if ((sp > 2 && sq > 2) || (sp < -2 && sq < -2)) continue;
    if (segmentIntersection(a, b, p, q, 1)) return false;
  }
  for (const [p, q] of chords) if (segmentIntersection(a, b, p, q, 1)) return false;
  // The region between the run and the chord (even-odd: it may be several lobes) holds no box and
  // not the rest of the ring, which crosses neither the run nor the chord.
  const pocket = ring.slice(s, t + 1 <= n ? t + 1 : n).concat(t === n ? [ring[0]] : []);
  if (unreached.some((bx) => polygonContainsPoint(pocket, [bx.minX, bx.minY]))) return false;
  return !polygonContainsPoint(pocket, ring[(t + 1) % n]);
}
