// Strip numbers on the editor canvas: base and cross numbers never overlap (they did: the cross
// layer's were only nudged 12 px off their own label points, onto the base layer's numbers).
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { planSchema } from '../../shared/plan/plan-schema';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { placeStripNumbers, type PlacedNumber } from '../../src/editor/canvas/place-strip-numbers';
import { fitCamera } from '../../src/editor/geometry/coords';
import { toDrawnTakeoff } from '../../src/editor/takeoff/to-drawn';

const examples = path.join(__dirname, '..', '..', 'examples');
const read = (f: string) => JSON.parse(fs.readFileSync(path.join(examples, f), 'utf8'));
// 10 px JetBrains Mono is about 6 px a digit; the test's measure errs wide.
const measure = (t: string) => t.length * 6.5;

const overlapping = (boxes: PlacedNumber[]) => {
  const pairs: [string, string][] = [];
  boxes.forEach((a, i) =>
    boxes.slice(i + 1).forEach((b) => {
      if (Math.abs(a.x - b.x) * 2 < a.w + b.w && Math.abs(a.y - b.y) * 2 < a.h + b.h) pairs.push([`${a.role} ${a.text}`, `${b.role} ${b.text}`]);
    }),
  );
  return pairs;
};

describe('strip numbers', () => {
  for (const [file, w, h] of [
    ['l-shape.json', 1120, 657],
    ['l-shape.json', 704, 470],
    ['l-shape.json', 672, 317],
    ['t-shape-chimney.json', 1120, 657],
    ['rectangle.json', 704, 470],
  ] as const) {
    it(`${file} at ${w} × ${h}: no two numbers overlap, and most strips are numbered`, () => {
      const plan = planSchema.parse(read(file));
      const t = computeTakeoff(plan, { products: parseProductCatalogue(read('products.json')) });
      const drawn = toDrawnTakeoff(t);
      expect(drawn.layers.map((l) => l.role)).toContain('cross');
      const cam = fitCamera(plan.outline, w, h);
      const placed = placeStripNumbers(drawn.layers, cam, measure);
      expect(overlapping(placed)).toEqual([]);
      const strips = drawn.layers.reduce((n, l) => n + l.strips.length, 0);
      expect(placed.length / strips).toBeGreaterThanOrEqual(0.6);
    });
  }

  it.each([
    ['t-shape-chimney.json', 1120, 657],
    ['l-shape.json', 672, 317], // the tablet canvas
  ] as const)('the old placement (cross numbers 12 px off their label points) overlapped: %s at %i × %i', (file, w, h) => {
    const plan = planSchema.parse(read(file));
    const drawn = toDrawnTakeoff(computeTakeoff(plan, { products: parseProductCatalogue(read('products.json')) }));
    const cam = fitCamera(plan.outline, w, h);
    const old: PlacedNumber[] = drawn.layers.flatMap((l) =>
      l.strips.map((s) => {
        const off = l.role === 'base' ? 0 : 12;
        return {
          x: s.labelAt[0] * cam.zoom + cam.panX + off,
          y: s.labelAt[1] * cam.zoom + cam.panY + off,
          w: measure(String(s.number)) + 4,
          h: 13,
          text: String(s.number),
          role: l.role,
        };
      }),
    );
    expect(overlapping(old).length).toBeGreaterThan(0);
  });
});
