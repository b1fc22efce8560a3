import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue, type TakeoffProduct } from '../../shared/takeoff/products';

/*
 * The automatic product choice ("choose for me": no plan.products). Trade expectations checked here
 * (common practice, not a published standard):
 * - base layer (between the joists): the lane is matched to the bay (centres − joist width), the
 *   narrowest lane that still fills it, so split rolls are cut to suit the joist centres;
 * - cross layer (over the joists): of the needed thickness, all else equal, the widest lane (an
 *   unsplit roll) means fewer strips to cut and fewer joints.
 */
const examples = join(__dirname, '../../examples');
const products = parseProductCatalogue(JSON.parse(readFileSync(join(examples, 'products.json'), 'utf8')));
const rectangle = JSON.parse(readFileSync(join(examples, 'rectangle.json'), 'utf8'));

function plan(over: Record<string, unknown>): Plan {
  return planSchema.parse({ ...rectangle, ...over });
}

function chosen(p: Plan, catalogue: TakeoffProduct[]) {
  const t = computeTakeoff(p, { products: catalogue });
  return {
    base: t.layers.filter((l) => l.role === 'base').map((l) => ({ id: l.productId, lane: l.laneWidthMm })),
    cross: t.layers.filter((l) => l.role === 'cross').map((l) => ({ id: l.productId, lane: l.laneWidthMm, lanes: l.lanesPerRoll })),
  };
}

describe('automatic product choice: lanes', () => {
  // The QA case: 100 mm existing, compressed (counts as 50 mm), target 270 mm, nothing pinned.
  // examples/products.json has 150 mm both as a 3 × 380 mm split roll and as an unsplit 1140 mm
  // roll at the same price and coverage, so only the lane width tells them apart.
  const qa = plan({ existing: { depthMm: 100, condition: 'compressed' }, target: { depthMm: 270 } });

  it('lays the cross layer from the unsplit roll of the needed thickness, whatever the catalogue order', () => {
    for (const catalogue of [products, products.slice().reverse()]) {
      const c = chosen(qa, catalogue);
      expect(c.cross).toEqual([{ id: 'wool-150', lane: 1140, lanes: 1 }]);
    }
  });

  it('keeps the base layer on the narrowest lane that fills the bay (400 − 47 = 353 mm → 380 mm, not 570 mm)', () => {
    for (const catalogue of [products, products.slice().reverse()]) {
      expect(chosen(qa, catalogue).base).toEqual([{ id: 'wool-100-s3', lane: 380 }]);
    }
  });

  it('moves the base layer to the 570 mm lane when the bay is wider than 380 mm (600 mm centres → 553 mm bay)', () => {
    const wide = plan({ existing: { depthMm: 100, condition: 'compressed' }, target: { depthMm: 270 }, joists: { ...rectangle.joists, centresMm: 600 } });
    const c = chosen(wide, products);
    expect(c.base).toEqual([{ id: 'wool-100-s2', lane: 570 }]);
    expect(c.cross).toEqual([{ id: 'wool-150', lane: 1140, lanes: 1 }]);
  });

  it('prefers the widest lane on a U-value target too (the same 150 mm top-up by split or unsplit roll)', () => {
    const u = plan({ existing: { depthMm: 100, condition: 'compressed' }, target: { uValue: 0.16 } });
    expect(chosen(u, products.slice().reverse()).cross).toEqual([{ id: 'wool-150', lane: 1140, lanes: 1 }]);
  });

  it('of two split rolls of the same thickness and cost per m², takes the wider lane for a cross layer (2 × 570 over 3 × 380)', () => {
    // U 0.2 over a 100 mm base and 50 mm counted existing needs one more 100 mm layer; the
    // catalogue's 100 mm rolls are both split.
    const u = plan({ existing: { depthMm: 100, condition: 'compressed' }, target: { uValue: 0.2 } });
    expect(chosen(u, products).cross).toEqual([{ id: 'wool-100-s2', lane: 570, lanes: 2 }]);
  });

  it('still ranks thickness before lane: with no unsplit 150 mm roll, the split 150 mm beats a thicker unsplit 170 mm (Quiltline rule: least overshoot first)', () => {
    const noUnsplit150 = products.filter((p) => p.id !== 'wool-150');
    expect(chosen(qa, noUnsplit150).cross).toEqual([{ id: 'wool-150-s3', lane: 380, lanes: 3 }]);
  });

  it('takes a wider but dearer roll of the same thickness only when the price per m² is equal (cost ranks before lane)', () => {
    const dearer = products.map((p) => (p.id === 'wool-150' ? { ...p, priceMinor: p.priceMinor + 100 } : p));
    expect(chosen(qa, dearer).cross).toEqual([{ id: 'wool-150-s3', lane: 380, lanes: 3 }]);
  });
});
