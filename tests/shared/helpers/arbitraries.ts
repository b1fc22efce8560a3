import fc from 'fast-check';
import type { Vec2 } from '../../../shared/geometry';
import { jstsPolygon } from './jsts-oracle';

// A failing property is shrunk by re-running it many times; with takeoffs and jsts inside that
// can take minutes. Give up (and fail) after two minutes rather than stall the suite.
fc.configureGlobal({ ...fc.readConfigureGlobal(), interruptAfterTimeLimit: 120_000, markInterruptAsFailure: true });

/**
 * A random simple polygon in mm: star-shaped about a centre (points at increasing angles with
 * random radii), so it never crosses itself, and often concave. 4–24 points, 1–12 m across.
 */
export function arbStarPolygon(opts: { minPoints?: number; maxPoints?: number; minR?: number; maxR?: number } = {}): fc.Arbitrary<Vec2[]> {
  const { minPoints = 4, maxPoints = 24, minR = 1500, maxR = 6000 } = opts;
  return fc
    .record({
      cx: fc.integer({ min: -20000, max: 20000 }),
      cy: fc.integer({ min: -20000, max: 20000 }),
      pts: fc.array(fc.record({ gap: fc.double({ min: 0.2, max: 1, noNaN: true }), r: fc.integer({ min: minR, max: maxR }) }), {
        minLength: minPoints,
        maxLength: maxPoints,
      }),
    })
    .map(({ cx, cy, pts }) => {
      const total = pts.reduce((t, p) => t + p.gap, 0);
      let acc = 0;
      return pts.map((p) => {
        acc += p.gap;
        const th = (2 * Math.PI * acc) / total;
        return [Math.round(cx + p.r * Math.cos(th)), Math.round(cy + p.r * Math.sin(th))] as Vec2;
      });
    })
    .filter((ring) => {
      // Rounding to whole mm can fold very close neighbours: keep clearly simple rings only.
      for (let i = 0; i < ring.length; i++) {
        const a = ring[i];
        const b = ring[(i + 1) % ring.length];
        if (Math.hypot(b[0] - a[0], b[1] - a[1]) < 50) return false;
      }
      // Shrinking can pull a corner onto another edge: let jsts (independent) reject such rings.
      return jstsPolygon([ring]).isValid();
    });
}

/** A random axis-aligned or slanted quadrilateral exclusion near the origin of a star polygon. */
export function arbQuad(centre: Vec2, spread = 5000): fc.Arbitrary<Vec2[]> {
  return fc
    .record({
      x: fc.integer({ min: -spread, max: spread }),
      y: fc.integer({ min: -spread, max: spread }),
      w: fc.integer({ min: 200, max: 2000 }),
      h: fc.integer({ min: 200, max: 2000 }),
      skew: fc.integer({ min: -300, max: 300 }),
    })
    .map(({ x, y, w, h, skew }) => {
      const x0 = centre[0] + x;
      const y0 = centre[1] + y;
      return [
        [x0, y0],
        [x0 + w, y0],
        [x0 + w + skew, y0 + h],
        [x0 + skew, y0 + h],
      ] as Vec2[];
    });
}
