import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { polygonContainsPoint } from '../../shared/geometry';
import { planSchema } from '../../shared/plan/plan-schema';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';

const dir = path.join(__dirname, '..', '..', 'examples');
const read = (f: string) => JSON.parse(fs.readFileSync(path.join(dir, f), 'utf8'));
const products = parseProductCatalogue(read('products.json'));
const plans = [
  'rectangle.json',
  'l-shape.json',
  't-shape-chimney.json',
  'tank-hatch-downlights.json',
  'angled-walls.json',
  'eaves-two-sides.json',
  'bungalow/main-loft.json',
  'bungalow/garage-loft.json',
];

describe('strip label points', () => {
  it.each(plans)('lie on their own strip in %s (so the job sheet can number every strip)', (file) => {
    const takeoff = computeTakeoff(planSchema.parse(read(file)), { products });
    for (const layer of takeoff.layers) {
      for (const strip of layer.strips) {
        expect(
          strip.polygons.some((poly) => polygonContainsPoint(poly, strip.labelAt)),
          `${strip.label} at ${strip.labelAt}`,
        ).toBe(true);
      }
    }
  });
});
