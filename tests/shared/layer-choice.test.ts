import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue, type TakeoffProduct } from '../../shared/takeoff/products';
import { loftCombinedMethod } from '../../shared/takeoff/thermal';

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

// The lane rules are checked on the insulated-area figure, so the whole-ceiling parts do not blur them.
function chosen(p: Plan, catalogue: TakeoffProduct[]) {
  const t = computeTakeoff(p, { products: catalogue, settings: { targetBasis: 'insulated-area' } });
  return {
    base: t.layers.filter((l) => l.role === 'base').map((l) => ({ id: l.productId, lane: l.laneWidthMm })),
    cross: t.layers.filter((l) => l.role === 'cross').map((l) => ({ id: l.productId, lane: l.laneWidthMm, lanes: l.lanesPerRoll })),
  };
}

describe('automatic product choice: lanes', () => {
  // 20 mm of good wool in 100 mm joists, target 270 mm, nothing pinned: the bays are 80 mm short,
  // so a 100 mm base goes in (20 + 100 = 120 mm), and 270 − 120 = 150 mm goes across.
  // examples/products.json has 150 mm both as a 3 × 380 mm split roll and as an unsplit 1140 mm
  // roll at the same price and coverage, so only the lane width tells them apart.
  const qa = plan({ existing: { depthMm: 20, condition: 'good' }, target: { depthMm: 270 } });

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
    const wide = plan({ existing: { depthMm: 20, condition: 'good' }, target: { depthMm: 270 }, joists: { ...rectangle.joists, centresMm: 600 } });
    const c = chosen(wide, products);
    expect(c.base).toEqual([{ id: 'wool-100-s2', lane: 570 }]);
    expect(c.cross).toEqual([{ id: 'wool-150', lane: 1140, lanes: 1 }]);
  });

  it('prefers the widest lane on a U-value target too (the same 150 mm top-up by split or unsplit roll)', () => {
    // 20 + 100 + 150 mm at 0.044 W/mK gives about U 0.161 (ISO 6946 combined method), inside 0.165.
    const u = plan({ existing: { depthMm: 20, condition: 'good' }, target: { uValue: 0.165 } });
    expect(chosen(u, products.slice().reverse()).cross).toEqual([{ id: 'wool-150', lane: 1140, lanes: 1 }]);
  });

  it('of two split rolls of the same thickness and cost per m², takes the wider lane for a cross layer (2 × 570 over 3 × 380)', () => {
    // U 0.2 over 20 mm existing and a 100 mm base is met by one more 100 mm layer, the cheapest
    // per m²; the catalogue's 100 mm rolls are both split.
    const u = plan({ existing: { depthMm: 20, condition: 'good' }, target: { uValue: 0.2 } });
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

/** A made-up roll, 1140 mm unsplit, 10 m² a roll, for the cost rules (prices per m² are price / 10). */
function roll(id: string, thicknessMm: number, lambda: number, pricePerM2: number): TakeoffProduct {
  return {
    id,
    name: id,
    thicknessMm,
    rollWidthMm: 1140,
    lanesPerRoll: 1,
    rollLengthMm: 8770,
    coverageM2PerRoll: 10,
    lambda,
    priceMinor: pricePerM2 * 10,
    roles: ['cross'],
  };
}
const ctx = {
  joistCentresMm: 400,
  joistWidthMm: 47,
  joistDepthMm: 100,
  rsi: 0.1,
  rse: 0.04,
  roofSpaceResistance: 0.2,
  ceilingBoardMm: 12.5,
  ceilingBoardLambda: 0.21,
  timberLambda: 0.13,
};

describe('base layer follows the physical fill of the bays, not the condition', () => {
  it('200 mm of patchy wool over 100 mm joists: no base layer, credited as 100 mm, one 170 mm cross layer', () => {
    // Physical 200 mm ≥ 100 − 10 mm tolerance: the bays are full. Credit 200 × 0.5 = 100 mm;
    // 270 − 100 = 170 mm → wool-170 (one layer, no overshoot).
    const t = computeTakeoff(plan({ existing: { depthMm: 200, condition: 'patchy' }, target: { depthMm: 270 } }), { products });
    expect(t.existing).toMatchObject({ physicalDepthMm: 200, effectiveDepthMm: 100, baseNeeded: false });
    expect(t.layers.map((l) => [l.role, l.productId])).toEqual([['cross', 'wool-170']]);
  });

  it('50 mm of good wool in 100 mm joists: the bays are filled first (100 mm base), then 150 mm across', () => {
    // Physical 50 mm < 90 mm: base, the thinnest ≥ 50 mm on the narrowest lane ≥ 353 mm → wool-100-s3.
    // 270 − (50 + 100) = 120 mm → one layer of 150 mm (the least overshoot of one layer), unsplit.
    const t = computeTakeoff(plan({ existing: { depthMm: 50, condition: 'good' }, target: { depthMm: 270 } }), { products });
    expect(t.existing.baseNeeded).toBe(true);
    expect(t.layers.map((l) => [l.role, l.productId])).toEqual([
      ['base', 'wool-100-s3'],
      ['cross', 'wool-150'],
    ]);
  });

  it('the condition changes the thermal credit only: 100 mm compressed lies at 100 mm, with the resistance of 50 mm', () => {
    // 100 mm at 0.044 / 0.5 = 0.088 W/mK has R = 0.1 / 0.088 = 1.136 m²K/W, as 50 mm at 0.044.
    const compressed = computeTakeoff(plan({ existing: { depthMm: 100, condition: 'compressed' }, target: { depthMm: 270 } }), { products });
    const good = computeTakeoff(plan({ existing: { depthMm: 100, condition: 'good' }, target: { depthMm: 270 } }), { products });
    expect(compressed.existing).toMatchObject({ physicalDepthMm: 100, effectiveDepthMm: 50, baseNeeded: false });
    expect(good.layers.map((l) => l.role)).toEqual(['cross']);
    expect(compressed.layers.every((l) => l.role === 'cross')).toBe(true);
    const expected = loftCombinedMethod([{ thicknessMm: 100, lambda: 0.088 }], ctx).uValue;
    expect(compressed.uValueBefore).toBeCloseTo(expected, 4);
    expect(compressed.uValueBefore).toBeGreaterThan(good.uValueBefore);
  });

  it('a depth with the condition "none" is not silently 0: it is warned about', () => {
    const t = computeTakeoff(plan({ existing: { depthMm: 150, condition: 'none' } }), { products });
    expect(t.warnings.map((w) => w.code)).toContain('existing.condition-none');
    expect(t.warnings.find((w) => w.code === 'existing.condition-none')!.message).toMatch(/150 mm/);
  });

  it('damp wool still fills the bays but earns no credit, and says how to get a base layer if it comes out', () => {
    const t = computeTakeoff(plan({ existing: { depthMm: 100, condition: 'damp' } }), { products });
    expect(t.existing).toMatchObject({ physicalDepthMm: 100, effectiveDepthMm: 0, baseNeeded: false });
    expect(t.warnings.map((w) => w.code)).toContain('existing.damp-no-credit');
  });
});

describe('U-value target: cheapest combination that meets it, then fewest layers', () => {
  // 100 mm of good wool fills the joists. Over it: 200 mm at 0.044 (R 4.545) vs 170 mm at 0.037 (R 4.595).
  const uThick = loftCombinedMethod(
    [
      { thicknessMm: 100, lambda: 0.044 },
      { thicknessMm: 200, lambda: 0.044 },
    ],
    ctx,
  ).uValue;
  const uThin = loftCombinedMethod(
    [
      { thicknessMm: 100, lambda: 0.044 },
      { thicknessMm: 170, lambda: 0.037 },
    ],
    ctx,
  ).uValue;

  it('takes the cheaper thicker roll over a dearer low-conductivity one when both meet the target', () => {
    expect(uThin).toBeLessThan(uThick); // both meet a target just above the thicker roll's U
    const target = Math.ceil(uThick * 1000) / 1000;
    const catalogue = [roll('thick-cheap', 200, 0.044, 450), roll('thin-dear', 170, 0.037, 575)];
    const t = computeTakeoff(plan({ existing: { depthMm: 100, condition: 'good' }, target: { uValue: target } }), {
      products: catalogue,
      settings: { targetBasis: 'insulated-area', maxCrossLayers: 1 },
    });
    expect(t.layers.map((l) => l.productId)).toEqual(['thick-cheap']);
    expect(t.thermal.meetsTarget).toBe(true);
  });

  it('of two combinations at the same cost per m², takes the one with fewer layers', () => {
    // 2 × 100 mm at 225 p/m² = 450 p/m², the same as 1 × 200 mm at 450 p/m², the same U.
    const target = Math.ceil(uThick * 1000) / 1000;
    const catalogue = [roll('wool-100-cheap', 100, 0.044, 225), roll('wool-200', 200, 0.044, 450)];
    const t = computeTakeoff(plan({ existing: { depthMm: 100, condition: 'good' }, target: { uValue: target } }), {
      products: catalogue,
      settings: { targetBasis: 'insulated-area' },
    });
    expect(t.layers.map((l) => l.productId)).toEqual(['wool-200']);
  });

  it('still prefers a cheaper two-layer combination to a dearer single layer', () => {
    // 2 × 100 mm at 200 p/m² = 400 p/m² beats 1 × 200 mm at 450 p/m².
    const target = Math.ceil(uThick * 1000) / 1000;
    const catalogue = [roll('wool-100-cheap', 100, 0.044, 200), roll('wool-200', 200, 0.044, 450)];
    const t = computeTakeoff(plan({ existing: { depthMm: 100, condition: 'good' }, target: { uValue: target } }), {
      products: catalogue,
      settings: { targetBasis: 'insulated-area' },
    });
    expect(t.layers.map((l) => l.productId)).toEqual(['wool-100-cheap', 'wool-100-cheap']);
  });
});
