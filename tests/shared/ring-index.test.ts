import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { polygonContainsPoint, type Vec2 } from '../../shared/geometry';
import { indexedContainsPoint, indexRing } from '../../shared/geometry/ring-index';
import { arbStarPolygon } from './helpers/arbitraries';

describe('ring index (point-in-ring through the walls near a height)', () => {
  it('answers exactly as the plain even-odd test, on corners, mid-edges and random points too', () => {
    fc.assert(
      fc.property(
        arbStarPolygon({ minPoints: 3, maxPoints: 60 }),
        fc.array(fc.tuple(fc.integer({ min: -30000, max: 30000 }), fc.integer({ min: -30000, max: 30000 })), { maxLength: 40 }),
        fc.double({ min: 0, max: 5, noNaN: true }),
        (ring, random, pad) => {
          const ix = indexRing(ring, pad);
          const corners = ring.map((p) => [p[0], p[1]] as Vec2);
          const mids = ring.map((p, i) => [(p[0] + ring[(i + 1) % ring.length][0]) / 2, (p[1] + ring[(i + 1) % ring.length][1]) / 2] as Vec2);
          for (const p of [...corners, ...mids, ...random]) expect(indexedContainsPoint(ix, p)).toBe(polygonContainsPoint(ring, p));
        },
      ),
      { numRuns: 200 },
    );
  });

  it('places a point in a square, and not beside it or beyond its top or bottom', () => {
    const square: Vec2[] = [
      [0, 0],
      [1000, 0],
      [1000, 1000],
      [0, 1000],
    ];
    const ix = indexRing(square);
    expect(indexedContainsPoint(ix, [500, 500])).toBe(true);
    expect(indexedContainsPoint(ix, [1500, 500])).toBe(false);
    expect(indexedContainsPoint(ix, [500, 1500])).toBe(false);
    expect(indexedContainsPoint(ix, [500, -1])).toBe(false);
  });
});
