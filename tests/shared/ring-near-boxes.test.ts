import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { intersectPolygons, polygonBounds, polygonContainsPoint, type Vec2 } from '../../shared/geometry';
import { ringNearBoxes } from '../../shared/geometry/ring-near-boxes';
import { differenceOfRing } from '../../shared/geometry/ring-difference';
import { differencePolygons } from '../../shared/geometry/boolean';
import { circlePolygon } from '../../shared/geometry/offset';
import { arbStarPolygon } from './helpers/arbitraries';

const rect = (x: number, y: number, w: number, h: number): Vec2[] => [
  [x, y],
  [x + w, y],
  [x + w, y + h],
  [x, y + h],
];

/** A wavy round outline of `n` points, radius about 13.7 m (as the stress plan's). */
function roundOutline(n: number): Vec2[] {
  return Array.from({ length: n }, (_, i) => {
    const th = (2 * Math.PI * i) / n;
    const r = 13_700 * (1 + 0.06 * Math.sin(7 * th));
    return [Math.round(r * Math.cos(th)), Math.round(r * Math.sin(th))] as Vec2;
  });
}

/** A band `gapMm` wide on the inner side of edge `i` of a positively wound ring. */
function bandOn(ring: Vec2[], i: number, gapMm = 50): Vec2[] {
  const a = ring[i];
  const b = ring[(i + 1) % ring.length];
  const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
  const nx = (-(b[1] - a[1]) / len) * gapMm;
  const ny = ((b[0] - a[0]) / len) * gapMm;
  return [a, b, [b[0] + nx, b[1] + ny], [a[0] + nx, a[1] + ny]];
}

describe('ringNearBoxes (the outline a sweep against small shapes needs)', () => {
  it('keeps a long outline only where the bands are, and the intersection comes out the same point for point', () => {
    const ring = roundOutline(400);
    const bands = Array.from({ length: 50 }, (_, k) => bandOn(ring, 2 * k));
    const trimmed = ringNearBoxes(
      ring,
      bands.map((b) => polygonBounds([b])),
    );
    expect(trimmed.length).toBeLessThan(150);
    expect(trimmed[0]).toBe(ring[0]);
    const shapes = bands.map((b) => [b]);
    expect(intersectPolygons([[trimmed]], shapes)).toEqual(intersectPolygons([[ring]], shapes));
  });

  it('takes no chord that would leave out a box between a run and the chord', () => {
    // A 20 m square with a point every 2 m; a band in one corner, and a shape in the middle that
    // no wall comes near: the one chord cutting off the corner would leave the middle out.
    const side = Array.from({ length: 10 }, (_, i) => 2000 * i);
    const square: Vec2[] = [
      ...side.map((x) => [x, 0] as Vec2),
      ...side.map((y) => [20000, y] as Vec2),
      ...side.map((x) => [20000 - x, 20000] as Vec2),
      ...side.map((y) => [0, 20000 - y] as Vec2),
    ];
    const band = bandOn(square, 0);
    const middle = rect(10000, 10000, 300, 300);
    const alone = ringNearBoxes(square, [polygonBounds([band])]);
    const both = ringNearBoxes(square, [polygonBounds([band]), polygonBounds([middle])]);
    expect(alone.length).toBeLessThan(8);
    expect(both.length).toBeGreaterThan(alone.length);
    expect(polygonContainsPoint(both, [10150, 10150])).toBe(true);
    expect(intersectPolygons([[both]], [[band], [middle]])).toEqual(intersectPolygons([[square]], [[band], [middle]]));
  });

  it('gives the same intersection as the whole ring, whatever the outline and wherever the bands', () => {
    fc.assert(
      fc.property(
        arbStarPolygon({ minPoints: 6, maxPoints: 60, minR: 3000, maxR: 20000 }),
        fc.array(fc.nat(), { minLength: 1, maxLength: 6 }),
        (ring, picks) => {
          const bands = picks.map((k) => bandOn(ring, k % ring.length));
          const shapes = bands.map((b) => [b]);
          const trimmed = ringNearBoxes(
            ring,
            bands.map((b) => polygonBounds([b])),
          );
          expect(intersectPolygons([[trimmed]], shapes)).toEqual(intersectPolygons([[ring]], shapes));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('takes the bands and shapes out of a long outline exactly as the whole sweep does', () => {
    const ring = roundOutline(400);
    const clips = [
      ...Array.from({ length: 50 }, (_, k) => [bandOn(ring, 2 * k)]),
      ...Array.from({ length: 12 }, (_, k) => [circlePolygon([-6000 + 900 * k, 300 * (k % 3)], 150 + 40 * (k % 4))]),
    ];
    expect(differenceOfRing(ring, clips)).toEqual(differencePolygons([[ring]], clips));
  });

  it('takes clips out of any outline exactly as the whole sweep does', () => {
    fc.assert(
      fc.property(
        arbStarPolygon({ minPoints: 6, maxPoints: 80, minR: 3000, maxR: 20000 }),
        fc.array(fc.nat(), { maxLength: 6 }),
        fc.array(fc.tuple(fc.integer({ min: -3000, max: 3000 }), fc.integer({ min: -3000, max: 3000 }), fc.integer({ min: 50, max: 900 })), { maxLength: 6 }),
        (ring, picks, discs) => {
          const c = ring.reduce((t, p) => [t[0] + p[0] / ring.length, t[1] + p[1] / ring.length], [0, 0]);
          const clips = [...picks.map((k) => [bandOn(ring, k % ring.length)]), ...discs.map(([dx, dy, r]) => [circlePolygon([c[0] + dx, c[1] + dy], r)])];
          expect(differenceOfRing(ring, clips)).toEqual(differencePolygons([[ring]], clips));
        },
      ),
      { numRuns: 300 },
    );
  });
});
