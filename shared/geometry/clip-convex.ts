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
  let out: Vec2[] = subject.map((p) => [p[0], p[1]]);
  const m = clip.length;
  for (let i = 0; i < m && out.length; i++) {
    const a = clip[i];
    const b = clip[(i + 1) % m];
    const ex = b[0] - a[0];
    const ey = b[1] - a[1];
    // Positive signed area: the inside lies to the +90° side of each clip edge.
    const side = (p: Vec2) => ex * (p[1] - a[1]) - ey * (p[0] - a[0]);
    const input = out;
    out = [];
    for (let k = 0; k < input.length; k++) {
      const p = input[k];
      const q = input[(k + 1) % input.length];
      const sp = side(p);
      const sq = side(q);
      if (sp >= 0) out.push(p);
      if (sp >= 0 !== sq >= 0) {
        const t = sp / (sp - sq);
        out.push([p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])]);
      }
    }
  }
  return out.length >= 3 ? out : [];
}
