import type { Box, Ring } from './polygon';
import { segmentIntersection } from './segment';
import type { Vec2 } from './vector';

/**
 * Clearances, mm: an edge whose bounds come within `EDGE_CLEARANCE_MM` of a box is kept as it
 * is, and a chord keeps `CHORD_CLEARANCE_MM` from every box. Both are far beyond anything the
 * booleans' micrometre grid or tolerances reach, so the sweep meets the part of the ring near
 * the boxes exactly as before; the edge clearance is the larger so that a chord, which starts a
 * metre from any box and heads away from the ring, still finds room.
 */
const EDGE_CLEARANCE_MM = 1000;
const CHORD_CLEARANCE_MM = 100;
/**
 * Rings shorter than this are swept whole: their sweep is cheap already, and the checks would
 * cost more than the points they could save (a drawn loft has a handful of corners).
 */
export const MIN_TRIMMED_RING_POINTS = 32;
/** Edges a chord stands for at most where one chord for a whole run is refused. */
const CHORD_EDGES = 16;

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
  const drop = ringPointsFarFromBoxes(ring, boxes);
  if (!drop) return ring as Vec2[];
  const out: Vec2[] = [];
  for (let k = 0; k < ring.length; k++) if (!drop[k]) out.push(ring[k] as Vec2);
  return out;
}

/**
 * The points `ringNearBoxes` leaves out (1 in the mask), or null when it keeps them all. Each
 * run of far edges keeps its first and last edge (so the points beside a chord have edges
 * nothing splits on the outer side too), and a run whose one chord is refused is tried in halves.
 */
export function ringPointsFarFromBoxes(ring: Ring, boxes: Box[]): Uint8Array | null {
  const n = ring.length;
  if (n < MIN_TRIMMED_RING_POINTS) return null;
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
  // The sweep starts each ring it returns at the ring's first point in its order (least x, then
  // least y): that point and its edges stay, so a ring comes out starting where it would have.
  let first = 0;
  for (let k = 1; k < n; k++) if (ring[k][0] < ring[first][0] || (ring[k][0] === ring[first][0] && ring[k][1] < ring[first][1])) first = k;
  far[first] = 0;
  far[(first + n - 1) % n] = 0;
  const unreached = boxes.filter((_, i) => !reached[i]);
  const drop = new Uint8Array(n);
  const chords: [Vec2, Vec2][] = [];
  let dropped = 0;
  // A chord from point a to point b for the edges between them; else, for a long run, chords of
  // at most CHORD_EDGES edges (they hug the wall, so shapes inside the loft stay clear of them);
  // else the halves in turn.
  const place = (a: number, b: number) => {
    if (b - a < 2) return;
    if (chordIsSafe(ring, a, b, clear, unreached, chords)) {
      for (let k = a + 1; k < b; k++) drop[k] = 1;
      dropped += b - a - 1;
      chords.push([ring[a] as Vec2, ring[b] as Vec2]);
    } else if (b - a > CHORD_EDGES) {
      const parts = Math.ceil((b - a) / CHORD_EDGES);
      for (let i = 0; i < parts; i++) place(a + Math.floor(((b - a) * i) / parts), a + Math.floor(((b - a) * (i + 1)) / parts));
    } else if (b - a >= 4) {
      const m = (a + b) >> 1;
      place(a, m);
      place(m, b);
    }
  };
  // Runs of far edges s..t−1 (from point s to point t, t = n meaning point 0): chords within
  // them from point s + 1 to point t − 1, so point 0 is never left out.
  for (let s = 0; s < n;) {
    if (!far[s]) {
      s++;
      continue;
    }
    let t = s;
    while (t < n && far[t]) t++;
    if (n - (t - s) >= 2) place(s + 1, t - 1);
    s = t;
  }
  return dropped ? drop : null;
}

/** Whether the chord from point `s` to point `t` (s < t < n) may stand for the edges between them (see `ringNearBoxes`). */
function chordIsSafe(ring: Ring, s: number, t: number, clear: Box[], unreached: Box[], chords: [Vec2, Vec2][]): boolean {
  const n = ring.length;
  const a = ring[s] as Vec2;
  const b = ring[t] as Vec2;
  const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
  if (len === 0) return false;
  for (const bx of clear) if (segmentMeetsBox(a, b, bx)) return false;
  // The chord's bounds with the tolerance: an edge outside them cannot touch it.
  const cx0 = Math.min(a[0], b[0]) - 2;
  const cx1 = Math.max(a[0], b[0]) + 2;
  const cy0 = Math.min(a[1], b[1]) - 2;
  const cy1 = Math.max(a[1], b[1]) + 2;
  // The edges outside the run: the two beside the chord share only its end points (and are not
  // collinear with it), the rest do not touch it at all. (Plain loops: no closure per call.)
  for (let k = 0; k < n; k++) {
    if (k >= s && k < t) continue;
    const p = ring[k];
    const q = ring[k + 1 < n ? k + 1 : 0];
    if (k === s - 1 || (s === 0 && k === n - 1)) {
      if (!askew(a, b, len, p, a)) return false;
      continue;
    }
    if (k === t) {
      if (!askew(a, b, len, q, b)) return false;
      continue;
    }
    if (Math.max(p[0], q[0]) < cx0 || Math.min(p[0], q[0]) > cx1 || Math.max(p[1], q[1]) < cy0 || Math.min(p[1], q[1]) > cy1) continue;
    // An edge with both ends more than the tolerance to one side of the chord's line cannot touch it.
    const sp = sideOf(a, b, len, p);
    const sq = sideOf(a, b, len, q);
    if ((sp > 2 && sq > 2) || (sp < -2 && sq < -2)) continue;
    if (segmentIntersection(a, b, p, q, 1)) return false;
  }
  for (const [p, q] of chords) {
    if (p === b) {
      if (!askew(a, b, len, q, b)) return false;
    } else if (q === a) {
      if (!askew(a, b, len, p, a)) return false;
    } else if (segmentIntersection(a, b, p, q, 1)) return false;
  }
  // The region between the run and the chord (even-odd: it may be several lobes) holds no box and
  // not the rest of the ring, which crosses neither the run nor the chord.
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (let k = s; k <= t; k++) {
    const p = ring[k];
    if (p[0] < minX) minX = p[0];
    if (p[0] > maxX) maxX = p[0];
    if (p[1] < minY) minY = p[1];
    if (p[1] > maxY) maxY = p[1];
  }
  for (const bx of unreached) {
    if (bx.minX < minX || bx.minX > maxX || bx.minY < minY || bx.minY > maxY) continue;
    if (runContainsPoint(ring, s, t, bx.minX, bx.minY)) return false;
  }
  const rest = ring[(t + 1) % n];
  return !runContainsPoint(ring, s, t, rest[0], rest[1]);
}

/** Signed distance of `p` from the line through `a` and `b` (`len` apart), mm. */
function sideOf(a: Vec2, b: Vec2, len: number, p: readonly number[]): number {
  return ((b[0] - a[0]) * (p[1] - a[1]) - (b[1] - a[1]) * (p[0] - a[0])) / len;
}

/** Whether `other` lies off the chord's line (an edge or chord from `end` to it meets the chord only at `end`). */
function askew(a: Vec2, b: Vec2, len: number, other: readonly number[], end: readonly number[]): boolean {
  return Math.abs(sideOf(a, b, len, other)) > 1e-6 * Math.hypot(other[0] - end[0], other[1] - end[1]);
}

/** Even-odd test of (x, y) against the closed path of points s..t of `ring` (closed by the chord t → s). */
function runContainsPoint(ring: Ring, s: number, t: number, x: number, y: number): boolean {
  let inside = false;
  for (let i = s, j = t; i <= t; j = i++) {
    const p = ring[i];
    const q = ring[j];
    if (p[1] > y !== q[1] > y && x < ((q[0] - p[0]) * (y - p[1])) / (q[1] - p[1]) + p[0]) inside = !inside;
  }
  return inside;
}
