import type { Ring } from './polygon';

/**
 * A ring cut into runs of `RING_CHUNK` consecutive points, each with its axis-aligned bounds:
 * made once per outline so that clipping it by many small convex shapes (one per eaves edge)
 * can pass over whole runs far from the clip (see `clipRingByConvex`). Chunk `c` covers points
 * `c·RING_CHUNK` up to the ring's end, bounds `minX[c]..maxX[c]` × `minY[c]..maxY[c]`, mm.
 */
export interface RingChunks {
  pointCount: number;
  minX: Float64Array;
  minY: Float64Array;
  maxX: Float64Array;
  maxY: Float64Array;
}

/** Points per chunk: small enough that few points lie in a chunk a clip's edge crosses. */
export const RING_CHUNK = 16;

/** The chunks of `ring` (see `RingChunks`). */
export function ringChunks(ring: Ring): RingChunks {
  const n = ring.length;
  const nc = Math.ceil(n / RING_CHUNK);
  const minX = new Float64Array(nc).fill(Infinity);
  const minY = new Float64Array(nc).fill(Infinity);
  const maxX = new Float64Array(nc).fill(-Infinity);
  const maxY = new Float64Array(nc).fill(-Infinity);
  for (let k = 0; k < n; k++) {
    const c = (k / RING_CHUNK) | 0;
    const [x, y] = ring[k];
    if (x < minX[c]) minX[c] = x;
    if (x > maxX[c]) maxX[c] = x;
    if (y < minY[c]) minY[c] = y;
    if (y > maxY[c]) maxY[c] = y;
  }
  return { pointCount: n, minX, minY, maxX, maxY };
}

/** What a chunk's bounds tell of a half-plane: every point surely inside, surely outside, or not known. */
const INSIDE = 1;
const OUTSIDE = -1;
const UNKNOWN = 0;

/**
 * Where the chunk `c` lies against the half-plane left of `a + t·(ex, ey)` as the sign of
 * `ex·(y − ay) − ey·(x − ax)` computed at each point would say. The side is linear, so its
 * extremes over the bounds are at their corners; the margin (10⁻⁹ of the terms' size, some
 * million times the rounding error of either sum) keeps a point whose computed sign could
 * differ from its corners' out of both answers.
 */
function chunkSide(C: RingChunks, c: number, ax: number, ay: number, ex: number, ey: number): number {
  const dy0 = C.minY[c] - ay;
  const dy1 = C.maxY[c] - ay;
  const dx0 = C.minX[c] - ax;
  const dx1 = C.maxX[c] - ax;
  const hiS = Math.max(ex * dy0, ex * dy1) - Math.min(ey * dx0, ey * dx1);
  const loS = Math.min(ex * dy0, ex * dy1) - Math.max(ey * dx0, ey * dx1);
  const margin = 1e-9 * (Math.abs(ex) * Math.max(Math.abs(dy0), Math.abs(dy1)) + Math.abs(ey) * Math.max(Math.abs(dx0), Math.abs(dx1)));
  if (loS > margin) return INSIDE;
  if (hiS < -margin) return OUTSIDE;
  return UNKNOWN;
}

/**
 * Per chunk, the first clip edge (0…m−1) whose half-plane its points all lie outside of while
 * inside every earlier one, or −1 when the bounds do not tell (or the points pass every edge).
 * `clip` is wound with positive area, as Sutherland–Hodgman reads it. Written to `out`.
 */
export function chunkFates(C: RingChunks, clip: Ring, out: Int32Array): void {
  const m = clip.length;
  const nc = C.minX.length;
  for (let c = 0; c < nc; c++) {
    let fate = -1;
    for (let i = 0; i < m; i++) {
      const a = clip[i];
      const b = clip[(i + 1) % m];
      const side = chunkSide(C, c, a[0], a[1], b[0] - a[0], b[1] - a[1]);
      if (side === INSIDE) continue;
      if (side === OUTSIDE) fate = i;
      break;
    }
    out[c] = fate;
  }
}
