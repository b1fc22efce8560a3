import type { Vec2 } from './vector';
import { isPolygonConvex, openRing, ringWithPositiveArea, type MultiPolygon, type Ring } from './polygon';
import { unionPolygons } from './boolean';

/** Segments used to approximate a full circle in clearances (a 16-gon keeps 98% of a circle's area). */
export const CIRCLE_SEGMENTS = 16;

/**
 * A regular polygon approximating a circle of `radiusMm` about `centre`, circumscribed so that
 * it contains the whole circle (a clearance must never be smaller than asked for).
 */
export function circlePolygon(centre: readonly number[], radiusMm: number, segments = CIRCLE_SEGMENTS): Vec2[] {
  const r = radiusMm / Math.cos(Math.PI / segments);
  const { cos, sin } = unitCircle(segments);
  const out: Vec2[] = [];
  for (let i = 0; i < cos.length; i++) out.push([centre[0] + r * cos[i], centre[1] + r * sin[i]]);
  return out;
}

// The corners' directions per segment count, worked out once (the same Math.cos and Math.sin of
// the same angles, so the same points): every downlight and every corner of a grown exclusion asks.
const unitCircles = new Map<number, { cos: number[]; sin: number[] }>();
function unitCircle(segments: number): { cos: number[]; sin: number[] } {
  let u = unitCircles.get(segments);
  if (!u) {
    u = { cos: [], sin: [] };
    for (let i = 0; i < segments; i++) {
      const a = (2 * Math.PI * (i + 0.5)) / segments;
      u.cos.push(Math.cos(a));
      u.sin.push(Math.sin(a));
    }
    if (unitCircles.size < 8) unitCircles.set(segments, u);
  }
  return u;
}

/**
 * A planar outward offset (Minkowski sum with a disc) of a simple ring by `distanceMm`, with
 * rounded corners approximated by `CIRCLE_SEGMENTS`-gons. Convex rings take a fast path (convex
 * hull of the corner discs); others are the union of the ring, one rectangle per edge and one
 * disc per corner. Distance 0 (or less) returns the ring itself. Planar on purpose: turf's buffer
 * is geodesic and would distort millimetre coordinates.
 */
export function polygonBuffer(ring: Ring, distanceMm: number): MultiPolygon {
  const base = ringWithPositiveArea(ring);
  if (!(distanceMm > 0)) return [[base]];
  if (isPolygonConvex(base)) {
    const pts: Vec2[] = [];
    for (const p of base) pts.push(...circlePolygon(p, distanceMm));
    return [[convexHull(pts)]];
  }
  const parts: Vec2[][][] = [[base]];
  const n = base.length;
  for (let i = 0; i < n; i++) {
    const a = base[i];
    const b = base[(i + 1) % n];
    const dx = b[0] - a[0];
    const dy = b[1] - a[1];
    const len = Math.hypot(dx, dy);
    if (len === 0) continue;
    const nx = (-dy / len) * distanceMm;
    const ny = (dx / len) * distanceMm;
    parts.push([
      [
        [a[0] + nx, a[1] + ny],
        [b[0] + nx, b[1] + ny],
        [b[0] - nx, b[1] - ny],
        [a[0] - nx, a[1] - ny],
      ],
    ]);
    parts.push([circlePolygon(a, distanceMm)]);
  }
  return unionPolygons(parts);
}

/** Convex hull of points (Andrew's monotone chain), positive signed area, no collinear points. */
export function convexHull(points: ReadonlyArray<readonly number[]>): Vec2[] {
  const pts = openRing(points as Ring).sort((a, b) => a[0] - b[0] || a[1] - b[1]);
  if (pts.length < 3) return pts;
  const cross = (o: Vec2, a: Vec2, b: Vec2) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const lower: Vec2[] = [];
  for (const p of pts) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], p) <= 0) lower.pop();
    lower.push(p);
  }
  const upper: Vec2[] = [];
  for (let i = pts.length - 1; i >= 0; i--) {
    const p = pts[i];
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], p) <= 0) upper.pop();
    upper.push(p);
  }
  lower.pop();
  upper.pop();
  return lower.concat(upper);
}
