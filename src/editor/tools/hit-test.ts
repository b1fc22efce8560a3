import type { Exclusion, Plan } from '../../../shared/plan/plan-schema';
import { boxOf, type BoxMm } from '../commands/resize-exclusion';
import { distanceToSegmentMm, world, type WorldPt } from '../geometry/coords';

/** The corner within `tolMm` of `p`, nearest first; -1 if none. */
export function hitCorner(plan: Plan, p: WorldPt, tolMm: number): number {
  let best = -1;
  let bestD = tolMm;
  plan.outline.forEach(([x, y], i) => {
    const d = Math.hypot(p.x - x, p.y - y);
    if (d <= bestD) {
      best = i;
      bestD = d;
    }
  });
  return best;
}

/** The outline edge within `tolMm` of `p` (closed outlines only), with the position t along it. */
export function hitEdge(plan: Plan, p: WorldPt, tolMm: number): { edge: number; t: number } | null {
  const n = plan.outline.length;
  if (n < 3) return null;
  let best: { edge: number; t: number } | null = null;
  let bestD = tolMm;
  for (let i = 0; i < n; i++) {
    const a = plan.outline[i];
    const b = plan.outline[(i + 1) % n];
    const { distMm, t } = distanceToSegmentMm(p, world(a[0], a[1]), world(b[0], b[1]));
    if (distMm <= bestD) {
      best = { edge: i, t };
      bestD = distMm;
    }
  }
  return best;
}

/** Midpoint (mm) of edge i, where the "insert corner" handle sits. */
export function edgeMidpoint(plan: Plan, i: number): [number, number] {
  const a = plan.outline[i];
  const b = plan.outline[(i + 1) % plan.outline.length];
  return [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2];
}

/**
 * The edge whose midpoint handle is within `tolMm` of `p`; edges shorter than `minLengthMm` have
 * no handle (they would crowd their own corners).
 */
export function hitEdgeMidpoint(plan: Plan, p: WorldPt, tolMm: number, minLengthMm = 0): number {
  const n = plan.outline.length;
  if (n < 3) return -1;
  for (let i = 0; i < n; i++) {
    const a = plan.outline[i],
      b = plan.outline[(i + 1) % n];
    if (Math.hypot(b[0] - a[0], b[1] - a[1]) < minLengthMm) continue;
    const [x, y] = edgeMidpoint(plan, i);
    if (Math.hypot(p.x - x, p.y - y) <= tolMm) return i;
  }
  return -1;
}

/** Even-odd ray test; points on the boundary may go either way. */
export function polygonContains(poly: ReadonlyArray<readonly [number, number]>, p: WorldPt): boolean {
  let inside = false;
  for (let i = 0, j = poly.length - 1; i < poly.length; j = i++) {
    const [xi, yi] = poly[i];
    const [xj, yj] = poly[j];
    if (yi > p.y !== yj > p.y && p.x < ((xj - xi) * (p.y - yi)) / (yj - yi) + xi) inside = !inside;
  }
  return inside;
}

/** The topmost (last drawn) exclusion under `p`; point exclusions count within `tolMm`. */
export function hitExclusion(plan: Plan, p: WorldPt, tolMm: number): number {
  for (let i = plan.exclusions.length - 1; i >= 0; i--) {
    const e = plan.exclusions[i];
    if (e.at && Math.hypot(p.x - e.at[0], p.y - e.at[1]) <= Math.max(tolMm, 60)) return i;
    if (e.polygon && polygonContains(e.polygon, p)) return i;
  }
  return -1;
}

export type BoxHandle = 'nw' | 'ne' | 'se' | 'sw';

export function exclusionBox(e: Exclusion): BoxMm | null {
  return e.polygon ? boxOf(e.polygon) : null;
}

/** Which corner handle of an exclusion's bounding box is within `tolMm` of `p`. */
export function hitBoxHandle(e: Exclusion, p: WorldPt, tolMm: number): BoxHandle | null {
  const b = exclusionBox(e);
  if (!b) return null;
  const handles: [BoxHandle, number, number][] = [
    ['nw', b.minX, b.minY],
    ['ne', b.maxX, b.minY],
    ['se', b.maxX, b.maxY],
    ['sw', b.minX, b.maxY],
  ];
  for (const [h, x, y] of handles) if (Math.hypot(p.x - x, p.y - y) <= tolMm) return h;
  return null;
}

/** Unit vector across the joists (their normal); joist centres lie at dot(p, n) = offset + k·centres. */
export function joistNormal(angleDeg: number): [number, number] {
  const a = (angleDeg * Math.PI) / 180;
  return [-Math.sin(a), Math.cos(a)];
}

/** Distance (mm) from `p` to the nearest joist centre line. */
export function distanceToJoistMm(plan: Plan, p: WorldPt): number {
  const [nx, ny] = joistNormal(plan.joists.angleDeg);
  const c = plan.joists.centresMm;
  const d = p.x * nx + p.y * ny - plan.joists.offsetMm;
  const r = ((d % c) + c) % c;
  return Math.min(r, c - r);
}
