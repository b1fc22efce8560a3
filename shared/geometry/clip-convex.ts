import type { Vec2 } from './vector';
import { ringWithPositiveArea, type Ring } from './polygon';

// Two coordinate lists used in turn, each pass reading one and filling the other; kept between
// calls (grown as needed), so clipping a long outline by many small eaves bands makes no garbage
// beyond the points it returns.
const scratch = { x: [new Float64Array(256), new Float64Array(256)], y: [new Float64Array(256), new Float64Array(256)] };

/**
 * Sutherland–Hodgman clipping of any simple ring by a convex ring (Sutherland and Hodgman,
 * "Reentrant polygon clipping", CACM 1974). O(n·m), no allocation beyond the output. The area of
 * the result is exact; where the subject is concave the result may contain zero-width bridges
 * along the clip's edges (harmless for areas and drawing, not for further booleans).
 * Returns an empty array when nothing is left.
 */
export function clipRingByConvex(subject: Ring, convexClip: Ring): Vec2[] {
  const clip = ringWithPositiveArea(convexClip);
  const m = clip.length;
  const { x: X, y: Y } = scratch;
  if (X[1].length < subject.length) {
    X[1] = new Float64Array(2 * subject.length);
    Y[1] = new Float64Array(2 * subject.length);
  }
  let xs = X[1];
  let ys = Y[1];
  let n = subject.length;
  for (let k = 0; k < n; k++) {
    xs[k] = subject[k][0];
    ys[k] = subject[k][1];
  }
  for (let i = 0; i < m && n; i++) {
    const a = clip[i];
    const b = clip[(i + 1) % m];
    const ax = a[0];
    const ay = a[1];
    const ex = b[0] - ax;
    const ey = b[1] - ay;
    // Positive signed area: the inside lies to the +90° side of each clip edge.
    // Each edge gives at most two points (its start and a crossing).
    if (X[i % 2].length < 2 * n) {
      X[i % 2] = new Float64Array(4 * n);
      Y[i % 2] = new Float64Array(4 * n);
    }
    const nx = X[i % 2];
    const ny = Y[i % 2];
    let c = 0;
    // Each point's side is worked out once and carried to the next edge (the same arithmetic).
    const s0 = ex * (ys[0] - ay) - ey * (xs[0] - ax);
    let sp = s0;
    for (let k = 0; k < n; k++) {
      const px = xs[k];
      const py = ys[k];
      const j = k + 1 < n ? k + 1 : 0;
      const qx = xs[j];
      const qy = ys[j];
      const sq = j ? ex * (qy - ay) - ey * (qx - ax) : s0;
      if (sp >= 0) {
        nx[c] = px;
        ny[c++] = py;
      }
      if (sp >= 0 !== sq >= 0) {
        const t = sp / (sp - sq);
        nx[c] = px + t * (qx - px);
        ny[c++] = py + t * (qy - py);
      }
      sp = sq;
    }
    xs = nx;
    ys = ny;
    n = c;
  }
  if (n < 3) return [];
  const out: Vec2[] = new Array(n);
  for (let k = 0; k < n; k++) out[k] = [xs[k], ys[k]];
  return out;
}
