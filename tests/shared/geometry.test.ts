import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  polygonArea,
  polygonSignedArea,
  polygonCentroid,
  polygonContainsPoint,
  isPolygonConvex,
  segmentIntersection,
  findRingSelfIntersections,
  rotateRing,
  translateRing,
  circlePolygon,
  polygonBuffer,
  convexHull,
  clipRingByConvex,
  multiPolygonArea,
  unionPolygons,
  differencePolygons,
  intersectPolygons,
  type Vec2,
} from '../../shared/geometry';
import { jstsPolygon } from './helpers/jsts-oracle';
import { arbStarPolygon } from './helpers/arbitraries';

const square: Vec2[] = [
  [0, 0],
  [1000, 0],
  [1000, 1000],
  [0, 1000],
];
const lShape: Vec2[] = [
  [0, 0],
  [9000, 0],
  [9000, 3600],
  [4200, 3600],
  [4200, 6800],
  [0, 6800],
];

describe('polygon area', () => {
  it.each([
    ['unit square 1 m', square, 1e6],
    ['L-shape of the l-shape example (by hand: 9.0×3.6 + 4.2×3.2)', lShape, 9000 * 3600 + 4200 * 3200],
    [
      'right triangle',
      [
        [0, 0],
        [3000, 0],
        [0, 4000],
      ] as Vec2[],
      6e6,
    ],
  ])('gives the area of the %s whichever way the outline winds', (_name, ring, expected) => {
    expect(polygonArea(ring)).toBeCloseTo(expected, 6);
    expect(polygonArea([...ring].reverse())).toBeCloseTo(expected, 6);
    expect(Math.sign(polygonSignedArea(ring))).toBe(-Math.sign(polygonSignedArea([...ring].reverse())));
  });

  it('gives 0 for fewer than three points and for collinear points', () => {
    expect(
      polygonArea([
        [0, 0],
        [10, 0],
      ]),
    ).toBe(0);
    expect(
      polygonArea([
        [0, 0],
        [10, 0],
        [20, 0],
      ]),
    ).toBe(0);
  });

  it('matches jsts on random simple polygons (jsts: independent planar oracle)', () => {
    fc.assert(
      fc.property(arbStarPolygon(), (ring) => {
        expect(polygonArea(ring)).toBeCloseTo(jstsPolygon([ring]).getArea(), 3);
      }),
      { numRuns: 200 },
    );
  });

  it('keeps the area when the polygon is rotated or moved', () => {
    fc.assert(
      fc.property(arbStarPolygon(), fc.double({ min: -360, max: 360, noNaN: true }), fc.integer({ min: -1e6, max: 1e6 }), (ring, deg, dx) => {
        const a = polygonArea(ring);
        expect(polygonArea(rotateRing(ring, deg, [123, -456]))).toBeCloseTo(a, 2);
        expect(polygonArea(translateRing(ring, [dx, -dx / 2]))).toBeCloseTo(a, 2);
      }),
      { numRuns: 100 },
    );
  });

  it('finds the centroid of a square and tests containment', () => {
    expect(polygonCentroid(square)).toEqual([500, 500]);
    expect(polygonContainsPoint(square, [500, 500])).toBe(true);
    expect(polygonContainsPoint(square, [1500, 500])).toBe(false);
    expect(isPolygonConvex(square)).toBe(true);
    expect(isPolygonConvex(lShape)).toBe(false);
  });
});

describe('segment intersection', () => {
  it.each([
    ['crossing', [0, 0], [10, 10], [0, 10], [10, 0], [5, 5]],
    ['touching at an end', [0, 0], [10, 0], [10, 0], [10, 10], [10, 0]],
    ['T-junction', [0, 0], [10, 0], [5, 0], [5, 10], [5, 0]],
    ['collinear overlap (first shared point)', [0, 0], [10, 0], [5, 0], [20, 0], [5, 0]],
    ['parallel apart', [0, 0], [10, 0], [0, 1], [10, 1], null],
    ['collinear apart', [0, 0], [10, 0], [11, 0], [20, 0], null],
    ['missing', [0, 0], [10, 0], [11, -5], [11, 5], null],
  ] as const)('%s', (_name, a1, a2, b1, b2, expected) => {
    const p = segmentIntersection(a1, a2, b1, b2);
    if (expected === null) expect(p).toBeNull();
    else {
      expect(p![0]).toBeCloseTo(expected[0], 9);
      expect(p![1]).toBeCloseTo(expected[1], 9);
    }
  });

  it('names the crossing edges of a bow-tie outline', () => {
    const bowTie: Vec2[] = [
      [0, 0],
      [6000, 0],
      [0, 4000],
      [6000, 4000],
    ];
    const crossings = findRingSelfIntersections(bowTie);
    expect(crossings).toHaveLength(1);
    expect(crossings[0]).toMatchObject({ edgeIndex: 1, otherEdgeIndex: 3 });
    expect(crossings[0].at[0]).toBeCloseTo(3000, 6);
    expect(crossings[0].at[1]).toBeCloseTo(2000, 6);
  });

  it('finds nothing wrong with simple outlines, including ones with collinear points', () => {
    expect(findRingSelfIntersections(lShape)).toEqual([]);
    expect(
      findRingSelfIntersections([
        [0, 0],
        [500, 0],
        [1000, 0],
        [1000, 1000],
        [0, 1000],
      ]),
    ).toEqual([]);
    fc.assert(
      fc.property(arbStarPolygon(), (ring) => {
        expect(findRingSelfIntersections(ring)).toEqual([]);
      }),
      { numRuns: 100 },
    );
  });

  it('reports an edge that doubles back along its neighbour', () => {
    const spike: Vec2[] = [
      [0, 0],
      [1000, 0],
      [1000, 1000],
      [1000, 500],
      [0, 1000],
    ];
    expect(findRingSelfIntersections(spike).length).toBeGreaterThan(0);
  });
});

describe('offsets and clipping', () => {
  it('circumscribes the circle it approximates', () => {
    const c = circlePolygon([100, 200], 150);
    for (const p of c) expect(Math.hypot(p[0] - 100, p[1] - 200)).toBeGreaterThanOrEqual(150);
    expect(polygonArea(c)).toBeGreaterThan(Math.PI * 150 * 150);
    expect(polygonArea(c)).toBeLessThan(Math.PI * 150 * 150 * 1.03);
  });

  it.each([
    ['convex square', square, 50],
    ['concave L', lShape, 120],
  ])('grows a %s like jsts buffer does (planar; within 0.5%%)', (_n, ring, d) => {
    const ours = multiPolygonArea(polygonBuffer(ring, d));
    const theirs = jstsPolygon([ring]).buffer(d, 16).getArea();
    expect(Math.abs(ours - theirs) / theirs).toBeLessThan(0.005);
  });

  it('takes the convex hull of points', () => {
    const hull = convexHull([
      [0, 0],
      [10, 0],
      [5, 5],
      [10, 10],
      [0, 10],
      [3, 3],
    ]);
    expect(polygonArea(hull)).toBe(100);
    expect(hull).toHaveLength(4);
  });

  it('clips any ring by a convex ring with the same area as jsts intersection', () => {
    fc.assert(
      fc.property(arbStarPolygon(), fc.integer({ min: -5000, max: 5000 }), fc.integer({ min: -5000, max: 5000 }), (ring, x, y) => {
        const clip: Vec2[] = [
          [x, y],
          [x + 4000, y + 500],
          [x + 3500, y + 3000],
          [x - 200, y + 2500],
        ];
        const ours = polygonArea(clipRingByConvex(ring, clip));
        const theirs = jstsPolygon([ring])
          .intersection(jstsPolygon([clip]))
          .getArea();
        expect(ours).toBeCloseTo(theirs, 1);
      }),
      { numRuns: 150 },
    );
  });

  it('unions, subtracts and intersects like jsts', () => {
    const a: Vec2[] = [
      [0, 0],
      [3000, 0],
      [3000, 3000],
      [0, 3000],
    ];
    const b: Vec2[] = [
      [1000, 1000],
      [4000, 1000],
      [4000, 2000],
      [1000, 2000],
    ];
    const ja = jstsPolygon([a]);
    const jb = jstsPolygon([b]);
    expect(multiPolygonArea(unionPolygons([[a], [b]]))).toBeCloseTo(ja.union(jb).getArea(), 6);
    expect(multiPolygonArea(differencePolygons([[a]], [[b]]))).toBeCloseTo(ja.difference(jb).getArea(), 6);
    expect(multiPolygonArea(intersectPolygons([[a]], [[b]]))).toBeCloseTo(ja.intersection(jb).getArea(), 6);
  });
});
