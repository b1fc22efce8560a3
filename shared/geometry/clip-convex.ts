import type { Vec2 } from './vector';
import { ringWithPositiveArea, type Ring } from './polygon';
import { chunkFates, RING_CHUNK, type RingChunks } from './ring-chunks';

// Two coordinate lists used in turn, each pass reading one and filling the other; kept between
// calls (grown as needed), so clipping a long outline by many small eaves bands makes no garbage
// beyond the points it returns.
const scratch = { x: [new Float64Array(256), new Float64Array(256)], y: [new Float64Array(256), new Float64Array(256)], fates: new Int32Array(64) };

/**
 * Sutherland–Hodgman clipping of any simple ring by a convex ring (Sutherland and Hodgman,
 * "Reentrant polygon clipping", CACM 1974). O(n·m), no allocation beyond the output. The area of
 * the result is exact; where the subject is concave the result may contain zero-width bridges
 * along the clip's edges (harmless for areas and drawing, not for further booleans).
 * Returns an empty array when nothing is left.
 *
 * With `chunks` (`ringChunks(subject)`, made once for a subject clipped many times) the points
 * that cannot change the result are left out before the first pass: a point whose neighbours
 * and itself all lie inside the clip's first k half-planes and outside the next one (as their
 * chunks' bounds show) is copied by the k passes before, makes no crossing with either
 * neighbour and is dropped by the next pass, as are they: without it the neighbours meet, and
 * make no crossing either. Points 0 and n−1 are always kept (the result starts where the
 * subject does). The result is the same, point for point.
 */
export function clipRingByConvex(subject: Ring, convexClip: Ring, chunks?: RingChunks): Vec2[] {
  const clip = ringWithPositiveArea(convexClip);
  const m = clip.length;
  const { x: X, y: Y } = scratch;
  if (X[1].length < subject.length) {
    X[1] = new Float64Array(2 * subject.length);
    Y[1] = new Float64Array(2 * subject.length);
  }
  let xs = X[1];
  let ys = Y[1];
  let n = 0;
  if (chunks && chunks.pointCount === subject.length) {
    if (scratch.fates.length < chunks.minX.length) scratch.fates = new Int32Array(2 * chunks.minX.length);
    const fates = scratch.fates;
    chunkFates(chunks, clip, fates);
    const last = subject.length - 1;
    const nc = chunks.minX.length;
    for (let c = 0; c < nc; c++) {
      const f = fates[c];
      const k0 = c * RING_CHUNK;
      const k1 = Math.min(last, k0 + RING_CHUNK - 1);
      const sameBefore = f >= 0 && c > 0 && fates[c - 1] === f;
      const sameAfter = f >= 0 && c + 1 < nc && fates[c + 1] === f;
      // A chunk whose neighbours share its fate gives nothing (its ends are interior to the run).
      if (sameBefore && sameAfter) continue;
      for (let k = k0; k <= k1; k++) {
        if (f >= 0 && k > 0 && k < last && (k > k0 || sameBefore) && (k < k1 || sameAfter)) continue;
        xs[n] = subject[k][0];
        ys[n++] = subject[k][1];
      }
    }
  } else {
    n = subject.length;
    for (let k = 0; k < n; k++) {
      xs[k] = subject[k][0];
      ys[k] = subject[k][1];
    }
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
