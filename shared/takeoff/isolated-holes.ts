import { segmentIntersection } from '../geometry/segment';
import { polygonBounds, type Box, type MultiPolygon, type PolygonWithHoles, type Ring } from '../geometry/polygon';
import { differencePolygons } from '../geometry/boolean';
import { differenceOfRing } from '../geometry/ring-difference';
import { indexedContainsPoint, indexRing, slabOf, type RingIndex } from '../geometry/ring-index';
import type { Vec2 } from '../geometry/vector';

const overlaps = (a: Box, b: Box) => a.minX <= b.maxX && a.maxX >= b.minX && a.minY <= b.maxY && a.maxY >= b.minY;

/**
 * `outline` minus the union of `shapes` and `others`, like `differencePolygons`, but exclusion
 * footprints that are isolated — strictly inside the outline, touching no wall, and whose bounds
 * meet no other shape's — become holes directly instead of going through the boolean sweep.
 * Most downlights, hatches and tanks are isolated, so the sweep (polygon-clipping, whose cost
 * grows with every vertex) sees only the outline, the eaves bands and the few shapes that touch
 * something. The result is the same region; a hole that cannot be placed falls back to the sweep.
 */
export function subtractShapes(outline: Vec2[], shapes: PolygonWithHoles[], others: Ring[]): MultiPolygon {
  const boxes = shapes.map((s) => polygonBounds([s[0]]));
  const otherBoxes = others.map((r) => polygonBounds([r]));
  const isolated = shapes.map((s) => s.length === 1);
  // Sweep by minX: any two shapes whose bounds meet are both left to the boolean sweep.
  const order = shapes.map((_, i) => i).sort((a, b) => boxes[a].minX - boxes[b].minX);
  for (let oi = 0; oi < order.length; oi++) {
    const a = order[oi];
    for (let oj = oi + 1; oj < order.length && boxes[order[oj]].minX <= boxes[a].maxX; oj++) {
      const b = order[oj];
      if (overlaps(boxes[a], boxes[b])) isolated[a] = isolated[b] = false;
    }
    if (otherBoxes.some((ob) => overlaps(boxes[a], ob))) isolated[a] = false;
  }
  const n = outline.length;
  const edgeBoxes: Box[] = outline.map((p, i) => {
    const q = outline[(i + 1) % n];
    return { minX: Math.min(p[0], q[0]), minY: Math.min(p[1], q[1]), maxX: Math.max(p[0], q[0]), maxY: Math.max(p[1], q[1]) };
  });
  // Point-in-outline tests through an index of the walls by height (see RingIndex).
  const outlineIndex = shapes.length ? indexRing(outline) : null;
  for (let i = 0; i < shapes.length; i++) {
    if (!isolated[i]) continue;
    const ring = shapes[i][0];
    if (!indexedContainsPoint(outlineIndex!, ring[0]) || touchesOutline(ring, boxes[i], outline, edgeBoxes, outlineIndex!)) isolated[i] = false;
  }
  const rest = shapes.filter((_, i) => !isolated[i]);
  const holes = shapes.filter((_, i) => isolated[i]).map((s) => s[0]);
  const clips = [...rest, ...others.map((r) => [r])];
  const region: MultiPolygon = clips.length ? differenceOfRing(outline, clips) : [[outline]];
  const homes: (RingIndex | undefined)[] = [];
  for (const hole of holes) {
    const home = region.find((poly, k) => indexedContainsPoint((homes[k] ??= indexRing(poly[0])), hole[0]));
    if (!home) return differencePolygons([[outline]], [...shapes, ...others.map((r) => [r])]);
    home.push(hole);
  }
  return region;
}

function touchesOutline(ring: Ring, box: Box, outline: Vec2[], edgeBoxes: Box[], index: RingIndex): boolean {
  const n = outline.length;
  // Only walls whose height range meets the shape's can touch it: those listed in its slabs.
  const s1 = slabOf(index, box.maxY);
  for (let i = index.start[slabOf(index, box.minY)]; i < index.start[s1 + 1]; i++) {
    const e = index.edges[i];
    if (!overlaps(box, edgeBoxes[e])) continue;
    const a = outline[e];
    const b = outline[(e + 1) % n];
    for (let k = 0; k < ring.length; k++) {
      if (segmentIntersection(ring[k], ring[(k + 1) % ring.length], a, b, 1e-6)) return true;
    }
  }
  return false;
}
