import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { clipRegionToBands, type Band, type Vec2 } from '../../shared/geometry';
import GeoJSONReader from 'jsts/org/locationtech/jts/io/GeoJSONReader.js';
import { jstsPolygon, jstsUnionAll } from './helpers/jsts-oracle';
import { arbStarPolygon } from './helpers/arbitraries';

/** Bands of a given width covering the y-range of the rings. */
function bandsOver(rings: Vec2[][], widthMm: number): Band[] {
  const ys = rings.flat().map((p) => p[1]);
  const lo = Math.min(...ys);
  const hi = Math.max(...ys);
  const out: Band[] = [];
  for (let y = lo; y < hi; y += widthMm) out.push({ loMm: y, hiMm: Math.min(y + widthMm, hi) });
  return out;
}

/** Area of a piece's drawn outlines, measured by jsts (an independent planar library). */
function outlinedAreaByJsts(polygons: Vec2[][]): number {
  return polygons.reduce((sum, ring) => {
    const g = jstsPolygon([ring]);
    expect(g.isValid()).toBe(true);
    return sum + g.getArea();
  }, 0);
}

describe('band piece outlines', () => {
  it('keep the inside corner of an L where a band steps from the long to the short wing', () => {
    // An L: 5000 deep for s < 3500, only 3000 deep beyond; one band spans the step at t = 3500.
    const l: Vec2[] = [
      [0, 0],
      [5000, 0],
      [5000, 3500],
      [3000, 3500],
      [3000, 9000],
      [0, 9000],
    ];
    const pieces = clipRegionToBands([l], [{ loMm: 2580, hiMm: 3720 }]);
    expect(pieces).toHaveLength(1);
    const [piece] = pieces;
    // By hand: 5000 × (3500 − 2580) + 3000 × (3720 − 3500) = 4,600,000 + 660,000 mm².
    expect(piece.areaMm2).toBeCloseTo(5_260_000, 3);
    expect(outlinedAreaByJsts(piece.polygons)).toBeCloseTo(5_260_000, 3);
    expect(piece.polygons[0]).toContainEqual([3000, 3500]);
  });

  it('outline exactly the area they report on random simple polygons (jsts as oracle)', () => {
    fc.assert(
      fc.property(arbStarPolygon(), fc.integer({ min: 150, max: 1200 }), (ring, widthMm) => {
        for (const piece of clipRegionToBands([ring], bandsOver([ring], widthMm))) {
          expect(Math.abs(outlinedAreaByJsts(piece.polygons) - piece.areaMm2)).toBeLessThan(1e-6 * piece.areaMm2 + 1);
        }
      }),
      { numRuns: 150 },
    );
  });

  it('give a label point strictly inside the piece, on random simple polygons (jsts as oracle)', () => {
    const reader = new GeoJSONReader();
    fc.assert(
      fc.property(arbStarPolygon(), fc.integer({ min: 150, max: 1200 }), (ring, widthMm) => {
        for (const piece of clipRegionToBands([ring], bandsOver([ring], widthMm))) {
          if (piece.areaMm2 < 100) continue;
          const point = reader.read({ type: 'Point', coordinates: piece.insideAt });
          expect(piece.polygons.some((poly) => (jstsPolygon([poly]) as unknown as { intersects(g: unknown): boolean }).intersects(point))).toBe(true);
        }
      }),
      { numRuns: 150 },
    );
  });

  it('put the label of a piece that forks around a hole on the piece, not in the hole', () => {
    // A 2000 × 1000 band area with a 1000 × 600 hole in the middle: the extent's middle is in the hole.
    const outer: Vec2[] = [
      [0, 0],
      [2000, 0],
      [2000, 1000],
      [0, 1000],
    ];
    const hole: Vec2[] = [
      [500, 200],
      [1500, 200],
      [1500, 800],
      [500, 800],
    ];
    const [piece] = clipRegionToBands([outer, hole], [{ loMm: 0, hiMm: 1000 }]);
    const [s, t] = piece.insideAt;
    expect(s >= 500 && s <= 1500 && t > 200 && t < 800).toBe(false);
  });
});

describe('band pieces around many obstacles in one band', () => {
  it('join into as many pieces as jsts finds, each with its area, when walls cross the band and holes fork it', () => {
    // A 30 m × 1 m band; walls (slanted quadrilaterals taller than the band) cut it into parts,
    // small holes between them fork a part without cutting it. Holes sit in cells of their own,
    // so nothing overlaps and the rings describe the region by the even-odd rule.
    const arbCell = fc.record({
      kind: fc.constantFrom('wall', 'hole', 'none'),
      w: fc.integer({ min: 40, max: 300 }),
      x: fc.integer({ min: 0, max: 150 }),
      skew: fc.integer({ min: -120, max: 120 }),
      lo: fc.integer({ min: 50, max: 450 }),
      hi: fc.integer({ min: 550, max: 950 }),
    });
    fc.assert(
      fc.property(fc.array(arbCell, { minLength: 1, maxLength: 40 }), (cells) => {
        const outer: Vec2[] = [
          [0, 0],
          [30_000, 0],
          [30_000, 1000],
          [0, 1000],
        ];
        const holes: Vec2[][] = [];
        cells.forEach((c, i) => {
          const s = 500 + i * 700 + c.x;
          if (c.kind === 'wall')
            holes.push([
              [s, -1],
              [s + c.w, -1],
              [s + c.w + c.skew, 1001],
              [s + c.skew, 1001],
            ]);
          else if (c.kind === 'hole')
            holes.push([
              [s, c.lo],
              [s + c.w, c.lo],
              [s + c.w + c.skew / 4, c.hi],
              [s + c.skew / 4, c.hi],
            ]);
        });
        // jsts: the band minus the walls and holes (one piece per polygon of the result).
        const band = jstsPolygon([outer]);
        const region = holes.length ? band.difference(jstsUnionAll(holes.map((h) => jstsPolygon([h])))) : band;
        const expected = region as unknown as { getNumGeometries(): number; getGeometryN(i: number): { getArea(): number } };
        // Even-odd rings: where a wall pokes out of the band it is outside the band's slab anyway.
        const pieces = clipRegionToBands([outer, ...holes], [{ loMm: 0, hiMm: 1000 }]);
        const areas = Array.from({ length: expected.getNumGeometries() }, (_, i) => expected.getGeometryN(i).getArea()).sort((a, b) => a - b);
        expect(pieces).toHaveLength(areas.length);
        pieces
          .map((p) => p.areaMm2)
          .sort((a, b) => a - b)
          .forEach((a, i) => expect(a).toBeCloseTo(areas[i], 3));
      }),
      { numRuns: 150 },
    );
  });
});
