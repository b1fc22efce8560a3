import type { Vec2 } from './vector';
import { ringWithPositiveArea, type Ring } from './polygon';

/**
 * Sutherland–Hodgman clipping of any simple ring by a convex ring (Sutherland and Hodgman,
 * "Reentrant polygon clipping", CACM 1974). O(n·m), no allocation beyond the output. The area of
 * the result is exact; where the subject is concave the result may contain zero-width bridges
 * along the clip's edges (harmless for areas and drawing, not for further booleans).
 * Returns an empty array when nothing is left.
 */
export function clipRingByConvex(subject: Ring, convexClip: Ring): Vec2[] {
  const clip = ringWithPositiveArea(convexClip);
  // The passes pass points along by reference (the outline's own corners among them); only what
  // is left at the end is copied, so clipping a long outline by a small band makes little garbage.
  let out: ReadonlyArray<readonly number[]> = subject;
  // Two lists used in turn, each pass reading one and filling the other.
  const lists: (readonly number[])[][] = [[], []];
  const m = clip.length;
  for (let i = 0; i < m && out.length; i++) {
    const a = clip[i];
    const b = clip[(i + 1) % m];
    const ax = a[0];
    const ay = a[1];
    const ex = b[0] - ax;
    const ey = b[1] - ay;
    // Positive signed area: the inside lies to the +90° side of each clip edge.
    const input = out;
    const next = lists[i % 2];
    next.length = 0;
    out = next;
    const n = input.length;
    for (let k = 0; k < n; k++) {
      const p = input[k];
      const q = input[k + 1 < n ? k + 1 : 0];
      const sp = ex * (p[1] - ay) - ey * (p[0] - ax);
      const sq = ex * (q[1] - ay) - ey * (q[0] - ax);
      if (sp >= 0) next.push(p);
      if (sp >= 0 !== sq >= 0) {
        const t = sp / (sp - sq);
        next.push([p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])]);
      }
    }
  }
  return out.length >= 3 ? out.map((p) => [p[0], p[1]] as Vec2) : [];
}
