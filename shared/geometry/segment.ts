import type { Vec2 } from './vector';
import type { Ring } from './polygon';

/**
 * Where segment `a1–a2` meets segment `b1–b2`: the point (the first shared point for collinear
 * overlaps), or `null` when they do not touch. Touching at an end point counts. `epsMm` is the
 * tolerance for "touching", in mm. Classic parametric test (e.g. O'Rourke, Computational Geometry in C, §7).
 */
export function segmentIntersection(a1: readonly number[], a2: readonly number[], b1: readonly number[], b2: readonly number[], epsMm = 1e-9): Vec2 | null {
  const rx = a2[0] - a1[0];
  const ry = a2[1] - a1[1];
  const sx = b2[0] - b1[0];
  const sy = b2[1] - b1[1];
  const qpx = b1[0] - a1[0];
  const qpy = b1[1] - a1[1];
  const denom = rx * sy - ry * sx;
  const lenR = Math.hypot(rx, ry);
  const lenS = Math.hypot(sx, sy);
  if (Math.abs(denom) <= 1e-12 * lenR * lenS) {
    // Parallel: collinear overlap only if b1 lies on a's line.
    const distLine = lenR === 0 ? Math.hypot(qpx, qpy) : Math.abs(qpx * ry - qpy * rx) / lenR;
    if (distLine > epsMm) return null;
    if (lenR === 0) return lenS === 0 ? (Math.hypot(qpx, qpy) <= epsMm ? [a1[0], a1[1]] : null) : pointOnSegment(a1, b1, b2, epsMm) ? [a1[0], a1[1]] : null;
    const t0 = (qpx * rx + qpy * ry) / (lenR * lenR);
    const t1 = t0 + (sx * rx + sy * ry) / (lenR * lenR);
    const lo = Math.max(0, Math.min(t0, t1));
    const hi = Math.min(1, Math.max(t0, t1));
    const tol = epsMm / lenR;
    if (lo > hi + tol) return null;
    return [a1[0] + lo * rx, a1[1] + lo * ry];
  }
  const t = (qpx * sy - qpy * sx) / denom;
  const u = (qpx * ry - qpy * rx) / denom;
  const tolT = lenR === 0 ? 0 : epsMm / lenR;
  const tolU = lenS === 0 ? 0 : epsMm / lenS;
  if (t < -tolT || t > 1 + tolT || u < -tolU || u > 1 + tolU) return null;
  return [a1[0] + t * rx, a1[1] + t * ry];
}

function pointOnSegment(p: readonly number[], a: readonly number[], b: readonly number[], eps: number): boolean {
  const abx = b[0] - a[0];
  const aby = b[1] - a[1];
  const len2 = abx * abx + aby * aby;
  if (len2 === 0) return Math.hypot(p[0] - a[0], p[1] - a[1]) <= eps;
  const t = Math.max(0, Math.min(1, ((p[0] - a[0]) * abx + (p[1] - a[1]) * aby) / len2));
  return Math.hypot(a[0] + t * abx - p[0], a[1] + t * aby - p[1]) <= eps;
}

/** Length of edge `i` of a ring (from point i to point i+1, wrapping), mm. */
export function ringEdgeLength(ring: Ring, i: number): number {
  const a = ring[i];
  const b = ring[(i + 1) % ring.length];
  return Math.hypot(b[0] - a[0], b[1] - a[1]);
}

/** One crossing of two non-adjacent edges of a ring. */
export interface RingCrossing {
  edgeIndex: number;
  otherEdgeIndex: number;
  at: Vec2;
}

/**
 * Pairs of edges of a closed ring that cross or touch, other than neighbours meeting at their
 * shared corner. Edge `i` runs from point `i` to point `i+1`. A sweep over edges sorted by their
 * left end keeps this near O(n log n) for plans (a 400-point outline takes microseconds).
 * Zero-length edges are skipped (report them separately). At most `limit` crossings are returned.
 */
export function findRingSelfIntersections(ring: Ring, limit = 20, epsMm = 1e-6): RingCrossing[] {
  const n = ring.length;
  const out: RingCrossing[] = [];
  if (n < 3) return out;
  const order: number[] = [];
  // Zero length exactly when both ends coincide (as `ringEdgeLength(ring, i) > 0` says, without Math.hypot's allocation).
  for (let i = 0; i < n; i++) {
    const p = ring[i];
    const q = ring[(i + 1) % n];
    if (p[0] !== q[0] || p[1] !== q[1]) order.push(i);
  }
  // Neighbours in ring order, skipping zero-length edges (they are reported on their own).
  const nextOf = new Map<number, number>();
  for (let k = 0; k < order.length; k++) nextOf.set(order[k], order[(k + 1) % order.length]);
  // Each edge's bounds worked out once (the sort and the sweep read them many times).
  const minX = new Float64Array(n);
  const maxX = new Float64Array(n);
  const minY = new Float64Array(n);
  const maxY = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const p = ring[i];
    const q = ring[(i + 1) % n];
    minX[i] = Math.min(p[0], q[0]);
    maxX[i] = Math.max(p[0], q[0]);
    minY[i] = Math.min(p[1], q[1]);
    maxY[i] = Math.max(p[1], q[1]);
  }
  const sorted = order.slice().sort((a, b) => minX[a] - minX[b]);
  for (let oi = 0; oi < sorted.length; oi++) {
    const i = sorted[oi];
    const hi = maxX[i] + epsMm;
    for (let oj = oi + 1; oj < sorted.length; oj++) {
      const j = sorted[oj];
      if (minX[j] > hi) break;
      // Edges whose heights lie apart cannot touch: a point within the tolerance of both lies
      // within it of either's heights, so a gap of over twice it (with room for rounding) rules them out.
      if (minY[j] > maxY[i] + 3 * epsMm || minY[i] > maxY[j] + 3 * epsMm) continue;
      const p = segmentIntersection(ring[i], ring[(i + 1) % n], ring[j], ring[(j + 1) % n], epsMm);
      if (!p) continue;
      const first = nextOf.get(i) === j ? i : nextOf.get(j) === i ? j : -1;
      if (first >= 0 && sorted.length > 2) {
        // Neighbours always share a corner; they only count when they fold back over each other.
        const second = nextOf.get(first)!;
        if (!foldsBack(ring[first], ring[(first + 1) % n], ring[second], ring[(second + 1) % n], epsMm)) continue;
      }
      out.push({ edgeIndex: Math.min(i, j), otherEdgeIndex: Math.max(i, j), at: p });
      if (out.length >= limit) break;
    }
    if (out.length >= limit) break;
  }
  return out.sort((a, b) => a.edgeIndex - b.edgeIndex || a.otherEdgeIndex - b.otherEdgeIndex);
}

/** Edge a0→a1 followed by edge b0→b1 (a1 ≈ b0): true when b runs back along a, or they touch elsewhere. */
function foldsBack(a0: readonly number[], a1: readonly number[], b0: readonly number[], b1: readonly number[], eps: number): boolean {
  const ux = a0[0] - a1[0];
  const uy = a0[1] - a1[1];
  const vx = b1[0] - b0[0];
  const vy = b1[1] - b0[1];
  const lu = Math.hypot(ux, uy);
  const lv = Math.hypot(vx, vy);
  const cross = ux * vy - uy * vx;
  const dot = ux * vx + uy * vy;
  if (Math.abs(cross) <= eps * Math.max(lu, lv) && dot > 0) return true;
  // With a zero-length edge between them the corners differ: then any meeting is a real touch.
  return Math.hypot(a1[0] - b0[0], a1[1] - b0[1]) > eps;
}
