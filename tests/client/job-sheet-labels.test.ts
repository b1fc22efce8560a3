// Strip numbers on the job sheet's plan: readable size on screen, never running into each other,
// thinned out when zoomed out (the cut list stays the full reference).
import { describe, expect, it } from 'vitest';
import { LABEL_MAX_PX, LABEL_MIN_PX, placeStripLabels, type LabelStrip, type PlacedLabel } from '../../src/features/job-sheet/components/strip-labels';

type Pt = [number, number];

/** Base-layer strips between joists at 400 mm centres (47 mm joists: 353 mm clear), running down the plan (y). */
function betweenJoists(n: number, lengthMm = 5200): LabelStrip[] {
  return Array.from({ length: n }, (_, i) => {
    const x0 = i * 400 + 47;
    const x1 = x0 + 353;
    return {
      id: `s${i + 1}`,
      label: `B${i + 1}`,
      polygons: [
        [
          [x0, 0],
          [x1, 0],
          [x1, lengthMm],
          [x0, lengthMm],
        ] as Pt[],
      ],
      labelAt: [(x0 + x1) / 2, lengthMm / 2] as Pt,
    };
  });
}

/** The label's box corners, worked out here independently: monospace advance 0.6 em per glyph (JetBrains Mono), height 1 em. */
function minimalBox(l: PlacedLabel): Pt[] {
  const w = l.label.length * 0.6 * l.fontSize;
  const h = l.fontSize;
  const r = (l.rotateDeg * Math.PI) / 180;
  return [
    [-w / 2, -h / 2],
    [w / 2, -h / 2],
    [w / 2, h / 2],
    [-w / 2, h / 2],
  ].map(([x, y]) => [l.x + x * Math.cos(r) - y * Math.sin(r), l.y + x * Math.sin(r) + y * Math.cos(r)] as Pt);
}

describe('strip numbers on the job sheet plan', () => {
  it('at phone zoom (353 mm strips about 14 px wide) turns the numbers along the strips, each inside its own strip, at a readable size', () => {
    const strips = betweenJoists(21); // an 8.4 m loft, as the demo plan
    const mmPerPx = 25;
    const { placed, hidden } = placeStripLabels(strips, mmPerPx);
    expect(hidden).toBe(0);
    expect(placed.map((l) => l.label)).toEqual(strips.map((s) => s.label));
    for (const l of placed) {
      expect(Math.abs(l.rotateDeg)).toBeCloseTo(90, 6);
      const px = l.fontSize / mmPerPx;
      expect(px).toBeGreaterThanOrEqual(LABEL_MIN_PX);
      expect(px).toBeLessThanOrEqual(LABEL_MAX_PX);
      const s = strips.find((x) => x.id === l.id)!;
      const [x0, x1] = [s.polygons[0][0][0], s.polygons[0][1][0]];
      for (const [x, y] of minimalBox(l)) {
        expect(x).toBeGreaterThan(x0);
        expect(x).toBeLessThan(x1);
        expect(y).toBeGreaterThan(0);
        expect(y).toBeLessThan(5200);
      }
    }
  });

  it('zoomed in, draws them level at full size', () => {
    const { placed, hidden } = placeStripLabels(betweenJoists(21), 5);
    expect(hidden).toBe(0);
    for (const l of placed) {
      expect(l.rotateDeg).toBe(0);
      expect(l.fontSize / 5).toBe(LABEL_MAX_PX);
    }
  });

  it('zoomed far out (strips 3.5 px wide) leaves out the numbers that would not fit, and counts them', () => {
    const { placed, hidden } = placeStripLabels(betweenJoists(21), 100);
    expect(placed).toEqual([]);
    expect(hidden).toBe(21);
  });

  it('never lets two numbers touch, even where strips overlap (a forked strip over another): the second moves to the middle of its strip', async () => {
    const a: LabelStrip = {
      id: 'a',
      label: 'C1.7',
      polygons: [
        [
          [0, 0],
          [1200, 0],
          [1200, 4000],
          [0, 4000],
        ],
      ],
      labelAt: [600, 2000],
    };
    const b: LabelStrip = {
      id: 'b',
      label: 'C1.8',
      polygons: [
        [
          [0, 1900],
          [1200, 1900],
          [1200, 6000],
          [0, 6000],
        ],
      ],
      labelAt: [600, 2050],
    };
    const { placed, hidden } = placeStripLabels([a, b], 10);
    expect(hidden).toBe(0);
    expect(placed.map((l) => [l.id, l.x, l.y])).toEqual([
      ['a', 600, 2000],
      ['b', 600, 3950],
    ]); // 3950: centre of the 1900..6000 strip
    const ys = placed.map((l) => minimalBox(l).map((p) => p[1]));
    expect(Math.max(...ys[0])).toBeLessThan(Math.min(...ys[1]));
    // With nowhere else to go on its strip, it is left out rather than drawn over the other.
    const c: LabelStrip = {
      id: 'c',
      label: 'C1.9',
      polygons: [
        [
          [0, 1990],
          [1200, 1990],
          [1200, 2010],
          [0, 2010],
        ],
      ],
      labelAt: [600, 2000],
    };
    expect(placeStripLabels([a, c], 1)).toMatchObject({ hidden: 1, placed: [{ id: 'a' }] });
  });

  it('finds a place for a number whose label point fell on a hatch cut out of its strip', () => {
    // A 1200 mm strip along x, with a 600 × 700 hatch cut out around its label point (plan units mm).
    const pieces: Pt[][] = [
      [
        [0, 0],
        [3600, 0],
        [3600, 1200],
        [0, 1200],
      ],
      [
        [4200, 0],
        [9000, 0],
        [9000, 1200],
        [4200, 1200],
      ],
    ];
    const { placed } = placeStripLabels([{ id: 'h', label: 'C1.7', polygons: pieces, labelAt: [3900, 600] }], 20);
    expect(placed).toHaveLength(1);
    expect(placed[0].x).toBeCloseTo(6600, 6); // middle of the larger piece
    expect(placed[0].y).toBeCloseTo(600, 6);
  });

  it('refuses a scale that is not a positive number', () => {
    expect(() => placeStripLabels(betweenJoists(2), 0)).toThrow(/mmPerPx must be a positive number/);
    expect(() => placeStripLabels(betweenJoists(2), Number.NaN)).toThrow(/mmPerPx/);
  });
});
