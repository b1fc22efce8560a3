import type { Vec2 } from './vector';

/**
 * Polygons as rings of points in millimetres, without a repeated closing point (a trailing
 * duplicate of the first point is tolerated and ignored by every function here).
 */
export type Ring = ReadonlyArray<readonly [number, number] | Vec2>;
/** A polygon with holes: the first ring is the outer boundary, the rest are holes. */
export type PolygonWithHoles = Ring[];
/** A set of disjoint polygons with holes, as polygon-clipping returns. */
export type MultiPolygon = PolygonWithHoles[];

/**
 * Signed area by the shoelace formula, mm². Positive when the ring turns from +x towards +y —
 * which is clockwise as drawn on a y-down screen, counter-clockwise in maths axes.
 */
export function polygonSignedArea(ring: Ring): number {
  const n = ring.length;
  if (n < 3) return 0;
  let sum = 0;
  // Relative to the first point: keeps precision for plans far from the origin.
  const x0 = ring[0][0];
  const y0 = ring[0][1];
  for (let i = 1; i < n - 1; i++) {
    const a = ring[i];
    const b = ring[i + 1];
    sum += (a[0] - x0) * (b[1] - y0) - (b[0] - x0) * (a[1] - y0);
  }
  return sum / 2;
}

/** Unsigned area of a ring, mm²; 0 for fewer than three points. The winding does not matter. */
export function polygonArea(ring: Ring): number {
  return Math.abs(polygonSignedArea(ring));
}

/** Area of a polygon with holes, mm²: outer minus holes (holes assumed inside and disjoint). */
export function polygonWithHolesArea(polygon: PolygonWithHoles): number {
  if (polygon.length === 0) return 0;
  let a = polygonArea(polygon[0]);
  for (let i = 1; i < polygon.length; i++) a -= polygonArea(polygon[i]);
  return a;
}

/** Area of a multipolygon of disjoint polygons, mm². */
export function multiPolygonArea(mp: MultiPolygon): number {
  let a = 0;
  for (const p of mp) a += polygonWithHolesArea(p);
  return a;
}

/** Area-weighted centroid of a ring, mm; the mean of its points when the area is zero. */
export function polygonCentroid(ring: Ring): Vec2 {
  const n = ring.length;
  if (n === 0) return [0, 0];
  const x0 = ring[0][0];
  const y0 = ring[0][1];
  let a2 = 0;
  let cx = 0;
  let cy = 0;
  for (let i = 0; i < n; i++) {
    const p = ring[i];
    const q = ring[(i + 1) % n];
    const px = p[0] - x0;
    const py = p[1] - y0;
    const qx = q[0] - x0;
    const qy = q[1] - y0;
    const c = px * qy - qx * py;
    a2 += c;
    cx += (px + qx) * c;
    cy += (py + qy) * c;
  }
  if (Math.abs(a2) < 1e-9) {
    let sx = 0;
    let sy = 0;
    for (const p of ring) {
      sx += p[0];
      sy += p[1];
    }
    return [sx / n, sy / n];
  }
  return [x0 + cx / (3 * a2), y0 + cy / (3 * a2)];
}

/**
 * Whether a point lies inside a ring (even-odd crossing test, W. R. Franklin's PNPOLY).
 * Points exactly on the boundary may fall either way.
 */
export function polygonContainsPoint(ring: Ring, p: readonly number[]): boolean {
  let inside = false;
  const n = ring.length;
  for (let i = 0, j = n - 1; i < n; j = i++) {
    const a = ring[i];
    const b = ring[j];
    if (a[1] > p[1] !== b[1] > p[1] && p[0] < ((b[0] - a[0]) * (p[1] - a[1])) / (b[1] - a[1]) + a[0]) {
      inside = !inside;
    }
  }
  return inside;
}

/** Axis-aligned bounds, mm. */
export interface Box {
  minX: number;
  minY: number;
  maxX: number;
  maxY: number;
}

/** Axis-aligned bounds of some rings, mm. Empty input gives Infinity bounds. */
export function polygonBounds(rings: Ring[]): Box {
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (const r of rings) {
    for (const p of r) {
      if (p[0] < minX) minX = p[0];
      if (p[0] > maxX) maxX = p[0];
      if (p[1] < minY) minY = p[1];
      if (p[1] > maxY) maxY = p[1];
    }
  }
  return { minX, minY, maxX, maxY };
}

/** Whether a ring is convex (collinear points allowed); rings with fewer than 3 points are not. */
export function isPolygonConvex(ring: Ring): boolean {
  const n = ring.length;
  if (n < 3) return false;
  let sign = 0;
  for (let i = 0; i < n; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % n];
    const c = ring[(i + 2) % n];
    const cross = (b[0] - a[0]) * (c[1] - b[1]) - (b[1] - a[1]) * (c[0] - b[0]);
    if (Math.abs(cross) < 1e-9) continue;
    const s = Math.sign(cross);
    if (sign === 0) sign = s;
    else if (s !== sign) return false;
  }
  return sign !== 0;
}

/** A copy of the ring without a repeated closing point. */
export function openRing(ring: Ring): Vec2[] {
  const out: Vec2[] = ring.map((p) => [p[0], p[1]]);
  if (out.length > 1) {
    const a = out[0];
    const b = out[out.length - 1];
    if (a[0] === b[0] && a[1] === b[1]) out.pop();
  }
  return out;
}

/** The ring wound with positive signed area (see `polygonSignedArea`); a copy either way. */
export function ringWithPositiveArea(ring: Ring): Vec2[] {
  const out = openRing(ring);
  return polygonSignedArea(out) < 0 ? out.reverse() : out;
}
