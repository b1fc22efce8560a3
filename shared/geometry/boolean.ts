import polygonClipping from 'polygon-clipping';
import type { Pair, MultiPolygon as PcMultiPolygon, Polygon as PcPolygon } from 'polygon-clipping';
import type { MultiPolygon, PolygonWithHoles } from './polygon';
import type { Vec2 } from './vector';

/**
 * Planar boolean operations on polygons in millimetres, through polygon-clipping (Martinez–Rueda
 * sweep line, robust to shared edges and overlaps). Inputs may wind either way and may repeat
 * the closing point; outputs are open rings (no repeated closing point), outer rings first.
 * polygon-clipping works in the plane, so unlike turf's area/buffer nothing here is geodesic.
 * Inputs are snapped to a micrometre grid (`BOOLEAN_GRID_MM`).
 */

/** Input grid, mm: coordinates are snapped to micrometres before the sweep. */
export const BOOLEAN_GRID_MM = 1e-3;

// Sweep-line booleans are fragile when points differ by far less than anything measured
// (polygon-clipping's open issues on loops come from such inputs); a micrometre grid removes
// those near-coincidences and changes no area a takeoff can show.
/** `x` on the booleans' input grid (`BOOLEAN_GRID_MM`), as the sweep sees it, mm. */
export const snapToBooleanGrid = (x: number) => Math.round(x / BOOLEAN_GRID_MM) * BOOLEAN_GRID_MM;

function toPc(polys: PolygonWithHoles[]): PcMultiPolygon {
  return polys
    .filter((p) => p.length > 0 && p[0].length >= 3)
    .map((p) => p.map((r) => r.map((q) => [snapToBooleanGrid(q[0]), snapToBooleanGrid(q[1])] as Pair)));
}

function fromPc(mp: PcMultiPolygon): MultiPolygon {
  return mp.map((poly: PcPolygon) =>
    poly.map((ring) => {
      const out = ring.map((q) => [q[0], q[1]] as Vec2);
      if (out.length > 1) {
        const a = out[0];
        const b = out[out.length - 1];
        if (a[0] === b[0] && a[1] === b[1]) out.pop();
      }
      return out;
    }),
  );
}

/** Union of any number of polygons (overlaps counted once). An empty list gives an empty result. */
export function unionPolygons(polys: PolygonWithHoles[]): MultiPolygon {
  const pc = toPc(polys);
  if (pc.length === 0) return [];
  if (pc.length === 1) return fromPc(polygonClipping.union(pc[0]));
  return fromPc(polygonClipping.union(pc[0], ...pc.slice(1).map((p) => [p])));
}

/** `subject` minus the union of `clips`. */
export function differencePolygons(subject: PolygonWithHoles[], clips: PolygonWithHoles[]): MultiPolygon {
  const s = toPc(subject);
  if (s.length === 0) return [];
  const c = toPc(clips);
  if (c.length === 0) return fromPc(polygonClipping.union(s));
  return fromPc(polygonClipping.difference(s, c));
}

/** Intersection of `a` and `b` (each a set of polygons, unioned first). */
export function intersectPolygons(a: PolygonWithHoles[], b: PolygonWithHoles[]): MultiPolygon {
  const pa = toPc(a);
  const pb = toPc(b);
  if (pa.length === 0 || pb.length === 0) return [];
  return fromPc(polygonClipping.intersection(pa, pb));
}
