import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { loftCombinedMethod } from '../../shared/takeoff/thermal';

/*
 * Whole-ceiling U-value: U = Σ(Aᵢ·Uᵢ) / ΣAᵢ over the gross ceiling (BS EN ISO 6946:2017 area
 * weighting of parts in parallel). Every part's U here is worked with the same combined method
 * (loftCombinedMethod), so the checks are of the weighting and of which build-up each part gets.
 */
const examples = join(__dirname, '../../examples');
const products = parseProductCatalogue(JSON.parse(readFileSync(join(examples, 'products.json'), 'utf8')));
const rectangle = JSON.parse(readFileSync(join(examples, 'rectangle.json'), 'utf8'));
const plan = (over: Record<string, unknown>): Plan => planSchema.parse({ ...rectangle, ...over });
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
const uBare = loftCombinedMethod([], ctx).uValue; // 1 / (0.10 + 0.0125/0.21 + 0.20 + 0.04) = 2.503
const u100 = loftCombinedMethod([{ thicknessMm: 100, lambda: 0.044 }], ctx).uValue;
const boards = {
  kind: 'boarded',
  polygon: [
    [500, 1000],
    [2500, 1000],
    [2500, 2500],
    [500, 2500],
  ],
}; // 2.0 × 1.5 = 3.0 m², clear of the hatch and bands

describe('whole-ceiling U-value', () => {
  it('weights the rectangle by hand: 42.42 m² insulated, 0.84 m² eaves strip (existing only), 0.42 m² bare hatch', () => {
    const t = computeTakeoff(plan({}), { products });
    expect(uBare).toBeCloseTo(2.503, 3);
    const uAfter = loftCombinedMethod(
      [
        { thicknessMm: 100, lambda: 0.044 },
        { thicknessMm: 170, lambda: 0.044 },
      ],
      ctx,
    ).uValue;
    const whole = (42.42 * uAfter + 0.84 * u100 + 0.42 * uBare) / 43.68;
    const wholeBefore = (43.26 * u100 + 0.42 * uBare) / 43.68;
    expect(t.uValueAfter).toBeCloseTo(uAfter, 4);
    expect(t.uValueAfterWholeCeiling).toBeCloseTo(whole, 4); // ≈ 0.189, against 0.161 for the insulated area alone
    expect(t.uValueBeforeWholeCeiling).toBeCloseTo(wholeBefore, 4);
    expect(t.thermal.wholeCeiling.parts.reduce((a, p) => a + p.areaM2, 0)).toBeCloseTo(43.68, 2);
  });

  it('credits a hatch lid insulated by the company (hatchInsulationMm) as a plain layer over the hatch', () => {
    const t = computeTakeoff(plan({}), { products, settings: { hatchInsulationMm: 100 } });
    // Hatch: 1 / (0.10 + 0.0595 + 0.1/0.044 + 0.20 + 0.04) = 0.376 W/m²K.
    const hatch = t.thermal.wholeCeiling.parts.find((p) => p.part === 'hatch')!;
    expect(hatch.uBefore).toBeCloseTo(uBare, 3);
    expect(hatch.uAfter).toBeCloseTo(1 / (0.1 + 0.0125 / 0.21 + 0.1 / 0.044 + 0.2 + 0.04), 3);
  });

  it('judges a U-value target on the whole ceiling by default, and says so', () => {
    // 0.19 is met by the insulated area with 270 mm (0.161) but the whole ceiling needs more:
    // insulated U must be ≤ (0.19 × 43.68 − 0.84 × u100 − 0.42 × uBare) / 42.42.
    const p = plan({ target: { uValue: 0.19 } });
    const t = computeTakeoff(p, { products });
    const needed = (0.19 * 43.68 - 0.84 * u100 - 0.42 * uBare) / 42.42;
    expect(t.thermal.targetJudgedOn).toBe('whole-ceiling');
    expect(t.uValueAfterWholeCeiling).toBeLessThanOrEqual(0.19);
    expect(t.uValueAfter).toBeLessThanOrEqual(needed + 1e-4);
    expect(t.thermal.meetsTarget).toBe(true);
    const flattering = computeTakeoff(p, { products, settings: { targetBasis: 'insulated-area' } });
    expect(flattering.thermal.targetJudgedOn).toBe('insulated-area');
    expect(flattering.uValueAfterWholeCeiling).toBeGreaterThan(t.uValueAfterWholeCeiling);
  });

  it('says a whole-ceiling target no insulation can reach is not met (the bare hatch alone exceeds it)', () => {
    // A 4 m² bare hatch in a 43.68 m² ceiling adds 4 × 2.503 / 43.68 = 0.229 W/m²K by itself, over a 0.2 target.
    const bigHatch = {
      kind: 'hatch',
      polygon: [
        [3000, 1500],
        [5000, 1500],
        [5000, 3500],
        [3000, 3500],
      ],
    };
    const t = computeTakeoff(plan({ target: { uValue: 0.2 }, exclusions: [bigHatch] }), { products });
    expect(t.thermal.meetsTarget).toBe(false);
    expect(t.thermal.depthForTargetUMm).toBeNull();
    expect(t.warnings.map((w) => w.code)).toContain('target.not-reached');
  });
});

describe('boarded areas: raise and insulate under, or leave boarded', () => {
  it('leave (the default): cut out of the layers, counted at the existing U, no legs', () => {
    const t = computeTakeoff(plan({ exclusions: [...rectangle.exclusions, boards] }), { products });
    expect(t.layerAreaM2).toBeCloseTo(42.42 - 3, 3);
    expect(t.exclusions.raisedBoardedAreaM2).toBe(0);
    expect(t.exclusions.items[1].boards).toBe('leave');
    const part = t.thermal.wholeCeiling.parts.find((p) => p.part === 'boarded')!;
    expect(part.areaM2).toBeCloseTo(3, 3);
    expect(part.uAfter).toBeCloseTo(u100, 4);
    expect(t.siteChecks.find((c) => c.code === 'boarded.raise-or-leave')!.message).toMatch(/3\.0 m² stays boarded and uninsulated/);
  });

  it('raise: the layers run under the boards, the U-value counts them insulated and the check asks for legs above the new depth', () => {
    const t = computeTakeoff(plan({ exclusions: [...rectangle.exclusions, { ...boards, boards: 'raise' }] }), { products });
    expect(t.layerAreaM2).toBeCloseTo(42.42, 3);
    expect(t.layers.every((l) => l.areaM2 === 42.42)).toBe(true);
    expect(t.exclusions.raisedBoardedAreaM2).toBe(3);
    expect(t.thermal.wholeCeiling.parts.map((p) => p.part)).not.toContain('boarded');
    // 100 mm existing + 170 mm cross = 270 mm for the legs to clear.
    expect(t.siteChecks.find((c) => c.code === 'boarded.raise-or-leave')!.message).toMatch(/raise 3\.0 m² of boards on legs so the deck clears the new 270 mm/);
  });

  it('refuses the boards choice on anything but a boarded area, naming the field', () => {
    const r = planSchema.safeParse({ ...rectangle, exclusions: [{ ...rectangle.exclusions[0], boards: 'raise' }] });
    expect(r.success).toBe(false);
    expect(r.error!.issues[0].path).toEqual(['exclusions', 0, 'boards']);
  });
});

describe('eaves: gap kept back or ventilators with the insulation over the wall plate', () => {
  it('gap (the default): two 50 mm bands kept back, no ventilators, the caution names BS 5250 and the cold edge', () => {
    const t = computeTakeoff(plan({}), { products });
    expect(t.eaves.mode).toBe('gap');
    expect(t.eaves.ventilatorCount).toBe(0);
    expect(t.eavesBandAreaM2).toBe(0.84);
    const check = t.siteChecks.find((c) => c.code === 'eaves.ventilation-gap')!;
    expect(check.message).toMatch(/BS 5250:2021/);
    expect(check.message).toMatch(/mould/);
  });

  it('ventilators: one per rafter space, ⌈8400 / 400⌉ = 21 on each of the two eaves edges = 42; the layers reach the wall', () => {
    const t = computeTakeoff(plan({ eavesMode: 'ventilators' }), { products });
    expect(t.eaves.ventilatorCount).toBe(42);
    expect(t.eavesBandAreaM2).toBe(0);
    expect(t.layerAreaM2).toBe(43.26);
    expect(t.thermal.wholeCeiling.parts.map((p) => p.part)).not.toContain('eaves-strip');
    const check = t.siteChecks.find((c) => c.code === 'eaves.ventilators')!;
    expect(check.count).toBe(42);
    expect(check.message).toMatch(/wall plate/);
    expect(check.message).toMatch(/BS 5250:2021/);
  });

  it('takes the company default when the plan does not say, the plan when it does, and the rafter centres from the roof', () => {
    expect(computeTakeoff(plan({}), { products, settings: { eavesMode: 'ventilators' } }).eaves.mode).toBe('ventilators');
    expect(computeTakeoff(plan({ eavesMode: 'gap' }), { products, settings: { eavesMode: 'ventilators' } }).eaves.mode).toBe('gap');
    // ⌈8400 / 600⌉ = 14 per edge → 28.
    expect(computeTakeoff(plan({ eavesMode: 'ventilators', roof: { rafterCentresMm: 600 } }), { products }).eaves.ventilatorCount).toBe(28);
  });

  it('whole-ceiling U is better with ventilators than with the bare 50 mm strip (the strip is insulated too)', () => {
    const gap = computeTakeoff(plan({}), { products });
    const vent = computeTakeoff(plan({ eavesMode: 'ventilators' }), { products });
    expect(vent.uValueAfterWholeCeiling).toBeLessThan(gap.uValueAfterWholeCeiling);
  });
});

describe('yearly saving over the whole ceiling', () => {
  it('is ΔU(whole) × gross area × degree days × 24 / 1000, and the note says the 15.5 °C base allows for gains', () => {
    const t = computeTakeoff(plan({}), { products, settings: { hatchInsulationMm: 100 } });
    // The hatch kit's credit now counts: ΔU over 43.68 m² includes the hatch going from 2.50 to 0.38.
    const heat = ((t.uValueBeforeWholeCeiling - t.uValueAfterWholeCeiling) * 43.68 * 2462 * 24) / 1000;
    expect(t.savings.areaM2).toBe(43.68);
    expect(t.savings.heatKwhPerYear).toBeCloseTo(heat, -1);
    expect(t.savings.note).toMatch(/15\.5 °C base .* allows for typical internal and solar gains/);
    expect(t.savings.note).not.toMatch(/ignores solar and internal gains/);
  });
});
