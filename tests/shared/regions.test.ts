import { describe, expect, it } from 'vitest';
import { subtractShapes } from '../../shared/takeoff/isolated-holes';
import { multiPolygonArea, type Vec2 } from '../../shared/geometry';
import { jstsPolygon, jstsUnionAll } from './helpers/jsts-oracle';

const rect = (x: number, y: number, w: number, h: number): Vec2[] => [
  [x, y],
  [x + w, y],
  [x + w, y + h],
  [x, y + h],
];
const outline = rect(0, 0, 10000, 6000);

function jstsArea(shapes: Vec2[][], others: Vec2[][] = []): number {
  const all = [...shapes, ...others].map((s) => jstsPolygon([s]));
  return jstsPolygon([outline]).difference(jstsUnionAll(all)).getArea();
}

describe('subtractShapes (isolated exclusions as direct holes)', () => {
  it.each([
    ['one shape well inside', [rect(1000, 1000, 500, 500)]],
    ['a shape flush with a wall', [rect(0, 1000, 500, 500)]],
    ['a shape across a wall', [rect(-200, 1000, 500, 500)]],
    ['two overlapping shapes', [rect(1000, 1000, 500, 500), rect(1200, 1200, 500, 500)]],
    ['a shape inside another', [rect(1000, 1000, 2000, 2000), rect(1500, 1500, 300, 300)]],
    [
      'a wall-to-wall band splitting the loft, with isolated shapes on both sides',
      [rect(4000, 0, 500, 6000), rect(1000, 1000, 400, 400), rect(7000, 3000, 400, 400)],
    ],
    ['a shape wholly outside', [rect(20000, 1000, 500, 500)]],
  ])('gives the area jsts gives for %s', (_n, shapes) => {
    const ours = multiPolygonArea(
      subtractShapes(
        outline,
        shapes.map((s) => [s]),
        [],
      ),
    );
    expect(ours).toBeCloseTo(jstsArea(shapes), 3);
  });

  it('leaves shapes near an eaves band to the sweep', () => {
    const band = rect(0, 0, 10000, 50);
    const shapes = [rect(1000, 20, 400, 400), rect(5000, 3000, 400, 400)];
    const ours = multiPolygonArea(
      subtractShapes(
        outline,
        shapes.map((s) => [s]),
        [band],
      ),
    );
    expect(ours).toBeCloseTo(jstsArea(shapes, [band]), 3);
  });
});
