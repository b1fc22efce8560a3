import GeoJSONReader from 'jsts/org/locationtech/jts/io/GeoJSONReader.js';
import 'jsts/org/locationtech/jts/monkey.js';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { placeMessage } from '../../src/editor/canvas/draw-issues';
import { clipLineToRing, joistSegments, outwardNormal } from '../../src/editor/geometry/lines';
import { formatArea, formatLength } from '../../src/editor/geometry/units';
import { rectPlan } from './fixtures';

// jsts (the JavaScript port of JTS) as an independent planar oracle for the clipped joist lines.
const reader = new GeoJSONReader();
const L: [number, number][] = [
  [0, 0],
  [6000, 0],
  [6000, 3000],
  [3500, 3000],
  [3500, 5000],
  [0, 5000],
];
const lengthInside = (ring: [number, number][], a: [number, number], b: [number, number]) =>
  reader
    .read({ type: 'Polygon', coordinates: [[...ring, ring[0]]] })
    .intersection(reader.read({ type: 'LineString', coordinates: [a, b] }))
    .getLength();

describe('joist lines drawn across the outline', () => {
  it('clips each line to the L-shaped outline exactly as jsts does', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 179, noNaN: true }), fc.double({ min: -6000, max: 6000, noNaN: true }), (deg, d) => {
        const a = (deg * Math.PI) / 180;
        const n: [number, number] = [-Math.sin(a), Math.cos(a)];
        // A line lying along a wall is left out on purpose (it would sit on the outline); jsts
        // counts it as inside, so such lines are not compared.
        const on = (p: [number, number]) => Math.abs(p[0] * n[0] + p[1] * n[1] - d) < 1e-6;
        fc.pre(!L.some((p, i) => on(p) && on(L[(i + 1) % L.length])));
        const ours = clipLineToRing(L, n, d).reduce((s, [p, q]) => s + Math.hypot(q[0] - p[0], q[1] - p[1]), 0);
        const dir = [n[1] * -1, n[0]];
        const far = 50_000;
        const base = [n[0] * d, n[1] * d];
        const theirs = lengthInside(L, [base[0] - dir[0] * far, base[1] - dir[1] * far], [base[0] + dir[0] * far, base[1] + dir[1] * far]);
        expect(ours).toBeCloseTo(theirs, 3);
      }),
      { numRuns: 200 },
    );
  });

  it('places joists every centres from the offset, across the whole outline', () => {
    const segs = joistSegments(L, { angleDeg: 0, centresMm: 600, offsetMm: 100 });
    const ys = [...new Set(segs.map(([p]) => Math.round(p[1])))].sort((a, b) => a - b);
    expect(ys).toEqual([100, 700, 1300, 1900, 2500, 3100, 3700, 4300, 4900]);
    // Below y = 3000 the L is 3500 wide, above it 6000 wide.
    expect(
      segs
        .find(([p]) => Math.round(p[1]) === 3700)!
        .map((p) => p[0])
        .sort((a, b) => a - b),
    ).toEqual([0, 3500]);
  });

  it('finds the outward normal whichever way the outline winds', () => {
    expect(outwardNormal(L, 0)).toEqual([0, -1]);
    const reversed = [...L].reverse();
    // Edge 0 of the reversed ring runs along the bottom wall (y = 5000): outward is +y.
    const [nx, ny] = outwardNormal(reversed, 0);
    expect([nx + 0, ny + 0]).toEqual([0, 1]);
  });
});

describe('display units', () => {
  it.each([
    [4200, 'metric', '4200'],
    [304.8, 'imperial', '1′ 0″'],
    [4200, 'imperial', '13′ 9 3/8″'], // 4200 mm = 165.354 in = 13 ft 9.354 in → 3/8
    [25.4 * 1.5, 'imperial', '0′ 1 1/2″'],
  ] as const)('%d mm in %s is %s', (mm, units, text) => {
    expect(formatLength(mm, units)).toBe(text);
  });

  it('shows areas in m² or ft² (1 m² = 10.7639 ft², NIST SP 811)', () => {
    expect(formatArea(25, 'metric')).toBe('25.00 m²');
    expect(formatArea(25, 'imperial')).toBe('269.1 ft²');
  });
});

describe('validation messages on the plan', () => {
  it('puts an edge message at the edge middle, a point message at the point, an exclusion message at its centre', () => {
    const plan = rectPlan();
    expect(placeMessage(plan, { code: 'x', message: 'm', edgeIndex: 1 }, 'error')?.at).toEqual([8400, 2600]);
    expect(placeMessage(plan, { code: 'x', message: 'm', pointIndex: 2 }, 'error')?.at).toEqual([8400, 5200]);
    expect(placeMessage(plan, { code: 'x', message: 'm', exclusionIndex: 0 }, 'warning')?.at).toEqual([1100, 950]);
    expect(placeMessage(plan, { code: 'x', message: 'm', exclusionIndex: 1 }, 'warning')?.at).toEqual([4200, 2600]);
    expect(placeMessage(plan, { code: 'x', message: 'no place' }, 'warning')).toBeNull();
  });
});
