import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { clipRingByConvex } from '../../shared/geometry/clip-convex';
import { ringChunks } from '../../shared/geometry/ring-chunks';
import type { Vec2 } from '../../shared/geometry/vector';
import { arbStarPolygon } from './helpers/arbitraries';

/** A thin rectangle on the inner side of edge `k` of `ring`, `gap` mm deep (as an eaves band is drawn), wound either way. */
function bandOnEdge(ring: Vec2[], k: number, gap: number, reversed: boolean): Vec2[] {
  const a = ring[k];
  const b = ring[(k + 1) % ring.length];
  const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
  const nx = (-(b[1] - a[1]) / len) * gap;
  const ny = ((b[0] - a[0]) / len) * gap;
  const rect: Vec2[] = [a, b, [b[0] + nx, b[1] + ny], [a[0] + nx, a[1] + ny]];
  return reversed ? rect.reverse() : rect;
}

describe('clipping a ring by its chunks', () => {
  it('gives the same points with the chunks as without, for bands along long outlines', () => {
    fc.assert(
      fc.property(
        arbStarPolygon({ minPoints: 20, maxPoints: 120, minR: 4000, maxR: 14000 }),
        fc.nat(),
        fc.integer({ min: 20, max: 3000 }),
        fc.boolean(),
        (ring, edge, gap, reversed) => {
          const clip = bandOnEdge(ring, edge % ring.length, gap, reversed);
          expect(clipRingByConvex(ring, clip, ringChunks(ring))).toEqual(clipRingByConvex(ring, clip));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('gives the same points for a clip anywhere, crossing the ring or not', () => {
    fc.assert(
      fc.property(
        arbStarPolygon({ minPoints: 16, maxPoints: 80 }),
        fc.integer({ min: -30000, max: 30000 }),
        fc.integer({ min: -30000, max: 30000 }),
        (ring, x, y) => {
          const clip: Vec2[] = [
            [x, y],
            [x + 4000, y + 500],
            [x + 3500, y + 3000],
            [x - 200, y + 2500],
          ];
          expect(clipRingByConvex(ring, clip, ringChunks(ring))).toEqual(clipRingByConvex(ring, clip));
        },
      ),
      { numRuns: 300 },
    );
  });

  it('ignores chunks made for another ring', () => {
    const ring: Vec2[] = [
      [0, 0],
      [1000, 0],
      [1000, 1000],
      [0, 1000],
    ];
    const clip: Vec2[] = [
      [500, -10],
      [2000, -10],
      [2000, 500],
      [500, 500],
    ];
    expect(clipRingByConvex(ring, clip, ringChunks(ring.slice(0, 3)))).toEqual(clipRingByConvex(ring, clip));
  });
});
