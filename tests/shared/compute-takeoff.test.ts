import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { validatePlan } from '../../shared/plan/validate-plan';
import { InvalidPlanError } from '../../shared/plan/plan-messages';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { computeTakeoff, DEFAULT_TAKEOFF_SETTINGS, TAKEOFF_FORMAT, type Takeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { loftCombinedMethod } from '../../shared/takeoff/thermal';
import { polygonCentroid } from '../../shared/geometry';
import { jstsPolygon, jstsUnionAll, type JstsGeometry } from './helpers/jsts-oracle';
import { stressPlan } from '../../scripts/stress-plan';

const examples = join(__dirname, '../../examples');
const products = parseProductCatalogue(JSON.parse(readFileSync(join(examples, 'products.json'), 'utf8')));

function loadExample(name: string): Plan {
  const r = validatePlan(JSON.parse(readFileSync(join(examples, name), 'utf8')));
  if (!r.ok) throw new Error(r.errors[0].message);
  return r.plan;
}

function listJson(dir: string): string[] {
  return readdirSync(dir).flatMap((n) =>
    statSync(join(dir, n)).isDirectory()
      ? listJson(join(dir, n))
      : n.endsWith('.json') && n !== 'products.json' && !n.includes('invalid')
        ? [join(dir, n)]
        : [],
  );
}
const exampleNames = listJson(examples).map((f) => f.slice(examples.length + 1));

/** Net area by jsts: outline minus the union of the exclusions, clearances by jsts's own planar buffer. */
function jstsNetAreaM2(plan: Plan): number {
  const s = DEFAULT_TAKEOFF_SETTINGS;
  const shapes: JstsGeometry[] = plan.exclusions.map((e) => {
    const c = e.clearanceMm ?? s.clearanceMmByKind[e.kind];
    if (e.at)
      return jstsPolygon([
        [
          [e.at[0], e.at[1]],
          [e.at[0] + 1e-3, e.at[1]],
          [e.at[0], e.at[1] + 1e-3],
        ],
      ]).buffer(s.pointFootprintRadiusMm + c, 16);
    const g = jstsPolygon([e.polygon!]);
    return c > 0 ? g.buffer(c, 16) : g;
  });
  const outline = jstsPolygon([plan.outline]);
  return (shapes.length ? outline.difference(jstsUnionAll(shapes)) : outline).getArea() / 1e6;
}

describe('computeTakeoff on the examples (golden checks)', () => {
  it('works out the rectangle by hand: 8.4 × 5.2 m, a 0.6 × 0.7 m hatch, 50 mm eaves bands on two 8.4 m edges', () => {
    const t = computeTakeoff(loadExample('rectangle.json'), { products });
    expect(t.grossAreaM2).toBe(43.68);
    expect(t.excludedAreaM2).toBe(0.42);
    expect(t.netAreaM2).toBe(43.26);
    expect(t.eavesBandAreaM2).toBe(0.84);
    expect(t.layerAreaM2).toBe(42.42);
    expect(t.eaves.bands.map((b) => b.areaM2)).toEqual([0.42, 0.42]);
    // 100 mm of good wool already fills the 100 mm joists: one cross layer of 170 mm reaches 270 mm.
    expect(t.layers.map((l) => [l.role, l.thicknessMm])).toEqual([['cross', 170]]);
    // Joists run along y, so cross strips run along x: full width of the loft, 8400 mm.
    expect(t.layers[0].layDirection.map(Math.abs)).toEqual([1, 0]);
    expect(t.layers[0].strips.every((s) => s.lengthMm === 8400)).toBe(true);
  });

  it.each(exampleNames)('gives %s a net area that matches jsts (clearances by jsts buffer)', (name) => {
    const plan = loadExample(name);
    const t = computeTakeoff(plan, { products });
    // Our clearance discs are circumscribed 16-gons, jsts's are inscribed: allow 3% of each disc.
    const discSlack = plan.exclusions.filter((e) => e.at).length * 0.03 * Math.PI * 0.15 ** 2;
    expect(Math.abs(t.netAreaM2 - jstsNetAreaM2(plan))).toBeLessThanOrEqual(0.005 + discSlack);
    expect(t.netAreaM2).toBeLessThanOrEqual(t.grossAreaM2);
    expect(t.layerAreaM2).toBeLessThanOrEqual(t.netAreaM2);
  });

  it.each(exampleNames)('gives %s a takeoff that keeps its own books', (name) => {
    const plan = loadExample(name);
    const t = computeTakeoff(plan, { products });
    expect(JSON.parse(JSON.stringify(t))).toEqual(t);
    expect(t.format).toBe(TAKEOFF_FORMAT);
    for (const layer of t.layers) {
      const product = products.find((p) => p.id === layer.productId)!;
      expect(layer.strips.map((s) => s.number)).toEqual(layer.strips.map((_, i) => i + 1));
      expect(layer.rollsByArea).toBe(Math.ceil((layer.areaM2 * (1 + t.wasteAllowancePct / 100)) / product.coverageM2PerRoll - 1e-9));
      expect(layer.laneWidthMm).toBeCloseTo(product.rollWidthMm / product.lanesPerRoll, 6);
      expect(Math.hypot(...layer.layDirection)).toBeCloseTo(1, 3);
      const plan = t.rollPlan.find((r) => r.productId === layer.productId)!;
      for (const s of layer.strips) {
        expect(s.lengthMm % DEFAULT_TAKEOFF_SETTINGS.cuttingAllowanceMm).toBe(0);
        // Cut at the true length: never beyond the long side by more than one cutting step per length cut.
        expect(s.lengthMm).toBeLessThanOrEqual(s.extentMm + DEFAULT_TAKEOFF_SETTINGS.cuttingAllowanceMm * Math.max(1, s.pieces.length) + 0.1);
        expect(s.pieces.reduce((t2, p) => t2 + p.lengthMm, 0)).toBeCloseTo(s.lengthMm, 6);
        expect(s.pieces.every((p) => p.lengthMm <= layer.rollLengthMm && p.roll >= 1 && p.roll <= plan.rolls && p.lane <= layer.lanesPerRoll)).toBe(true);
        expect(s.pieces.every((p) => p.widthMm <= layer.laneWidthMm + 1e-9)).toBe(true);
        expect(s.pieces.filter((p) => p.source !== 'offcut').every((p) => (p.source === 'lane') === p.widthMm >= layer.laneWidthMm - 0.5)).toBe(true);
        // The rectangle cut from the roll covers the piece of loft it fills.
        expect(s.areaM2).toBeLessThanOrEqual((s.lengthMm * s.bandWidthMm) / 1e6 + 1e-4);
      }
      expect(plan.rolls).toBeGreaterThanOrEqual(plan.rollsLowerBound);
      expect(t.layers.filter((l) => l.productId === layer.productId).reduce((n, l) => n + l.rollsByPacking, 0)).toBe(plan.rolls);
      if (layer.role === 'cross') expect(layer.coveredAreaM2).toBeCloseTo(layer.areaM2, 2);
      else expect(layer.coveredAreaM2).toBeLessThan(layer.areaM2);
    }
    const rebuilt = loftCombinedMethod(
      [
        // The existing layer lies at its physical depth, its λ divided by the condition's credit share.
        ...(t.existing.effectiveDepthMm > 0
          ? [{ thicknessMm: t.existing.physicalDepthMm, lambda: (0.044 * t.existing.physicalDepthMm) / t.existing.effectiveDepthMm }]
          : []),
        ...t.layers.map((l) => ({ thicknessMm: l.thicknessMm, lambda: l.lambda })),
      ],
      {
        joistCentresMm: plan.joists.centresMm,
        joistWidthMm: plan.joists.widthMm,
        joistDepthMm: plan.joists.depthMm,
        rsi: 0.1,
        rse: 0.04,
        roofSpaceResistance: 0.2,
        ceilingBoardMm: 12.5,
        ceilingBoardLambda: 0.21,
        timberLambda: 0.13,
      },
    );
    expect(t.uValueAfter).toBeCloseTo(rebuilt.uValue, 4);
    expect(t.uValueAfter).toBeLessThan(t.uValueBefore);
    expect(t.savings.heatKwhPerYear).toBeCloseTo(((t.uValueBefore - t.uValueAfter) * t.layerAreaM2 * 2462 * 24) / 1000, 0);
    expect(t.siteChecks.map((c) => c.code)).toEqual(
      expect.arrayContaining(['access.work-at-height', 'cables.over-insulation', 'eaves.ventilation-gap', 'local-regulations']),
    );
  });

  it('carries the fields of the JSON contract, named exactly', () => {
    const t = computeTakeoff(loadExample('l-shape.json'), { products }) as unknown as Record<string, unknown>;
    for (const k of ['format', 'grossAreaM2', 'netAreaM2', 'wasteAllowancePct', 'layers', 'uValueBefore', 'uValueAfter', 'siteChecks', 'warnings'])
      expect(t).toHaveProperty(k);
    const layer = (t.layers as Record<string, unknown>[])[0];
    for (const k of [
      'role',
      'productId',
      'thicknessMm',
      'areaM2',
      'rollLengthMm',
      'laneWidthMm',
      'lanesPerRoll',
      'coverageM2PerRoll',
      'strips',
      'rollsByPacking',
      'rollsByArea',
      'wastePct',
    ])
      expect(layer).toHaveProperty(k);
    expect((layer.strips as Record<string, unknown>[])[0]).toEqual(expect.objectContaining({ lengthMm: expect.any(Number), widthMm: expect.any(Number) }));
    for (const c of t.siteChecks as Record<string, unknown>[])
      expect(c).toEqual(expect.objectContaining({ code: expect.any(String), message: expect.any(String) }));
  });

  it('counts exclusions by kind and raises their site checks (tank, hatch, downlights, boards, flue)', () => {
    const t = computeTakeoff(loadExample('tank-hatch-downlights.json'), { products });
    expect(t.exclusions.countsByKind).toEqual({ hatch: 1, tank: 1, chimney: 0, flue: 1, boarded: 1, downlight: 5, other: 0 });
    const codes = Object.fromEntries(t.siteChecks.map((c) => [c.code, c]));
    expect(codes['downlight.covers'].count).toBe(5);
    expect(codes['tank.no-insulation-beneath'].exclusionIndices).toEqual([0]);
    expect(codes['flue.clearance'].message).toContain('50 mm');
    expect(codes['boarded.raise-or-leave'].message).toContain('3.5 m²');
    expect(codes['hatch.insulate-and-seal']).toBeDefined();
    expect(codes['ppe.dust']).toBeDefined();
    expect(codes['walkway.boards-span-joists']).toBeDefined();
    // Patchy 25 mm counts as 12.5 mm: a base layer goes between the joists, then a cross layer.
    expect(t.layers.map((l) => l.role)).toEqual(['base', 'cross']);
    expect(t.existing).toMatchObject({ effectiveDepthMm: 12.5, baseNeeded: true });
  });

  it('lays base strips along the joists, a bay wide, and cross strips across them', () => {
    const t = computeTakeoff(loadExample('t-shape-chimney.json'), { products });
    const [base, cross] = t.layers;
    expect(base.role).toBe('base');
    expect(base.bandWidthMm).toBe(353);
    expect(Math.abs(base.layDirection[1])).toBe(1);
    expect(cross.role).toBe('cross');
    expect(Math.abs(cross.layDirection[0])).toBe(1);
    expect(cross.bandWidthMm).toBe(cross.laneWidthMm);
  });

  it('numbers strips so that the last ones laid are next to the hatch', () => {
    const plan = loadExample('l-shape.json');
    const t = computeTakeoff(plan, { products });
    const hatch = polygonCentroid(plan.exclusions[0].polygon!);
    for (const layer of t.layers) {
      const dist = (i: number) => Math.hypot(layer.strips[i].labelAt[0] - hatch[0], layer.strips[i].labelAt[1] - hatch[1]);
      const last = dist(layer.strips.length - 1);
      const first = dist(0);
      expect(last).toBeLessThan(first);
      expect(layer.strips[layer.strips.length - 1].label).toBe(`${layer.role === 'base' ? 'B' : 'C1.'}${layer.strips.length}`);
    }
  });

  it('reaches a target U-value instead of a depth when the plan asks for one', () => {
    const t = computeTakeoff(loadExample('eaves-two-sides.json'), { products });
    expect(t.thermal.targetUValue).toBe(0.16);
    expect(t.thermal.meetsTarget).toBe(true);
    expect(t.uValueAfter).toBeLessThanOrEqual(0.16);
    expect(t.thermal.depthForTargetUMm).toBeGreaterThan(0);
  });

  it('keeps the eaves bands clear of every layer and reports their polygons', () => {
    const t = computeTakeoff(loadExample('eaves-two-sides.json'), { products });
    expect(t.eaves.bands).toHaveLength(2);
    expect(t.eaves.totalLengthMm).toBe(20400);
    for (const layer of t.layers)
      for (const s of layer.strips)
        for (const poly of s.polygons)
          for (const p of poly) {
            expect(p[1]).toBeGreaterThanOrEqual(50 - 0.1);
            expect(p[1]).toBeLessThanOrEqual(6400 - 50 + 0.1);
          }
  });

  it('uses products pinned in the plan and warns about unknown ones', () => {
    const plan = { ...loadExample('rectangle.json'), products: { crossProductIds: ['wool-100-s2', 'no-such-roll'] } };
    const t = computeTakeoff(plan, { products });
    expect(t.layers.map((l) => l.productId)).toEqual(['wool-100-s2']);
    expect(t.warnings.map((w) => w.code)).toContain('product.unknown');
  });

  it('applies company settings over the defaults', () => {
    const plan = loadExample('l-shape.json');
    const t5 = computeTakeoff(plan, { products, settings: { wasteAllowancePct: 5, fuelPriceMinorPerKwh: 10 } });
    const t10 = computeTakeoff(plan, { products });
    expect(t5.wasteAllowancePct).toBe(5);
    expect(t5.settings.degreeDays).toBe(2462);
    expect(t5.layers[0].rollsByArea).toBeLessThanOrEqual(t10.layers[0].rollsByArea);
    expect(t5.savings.moneyMinorPerYear).toBe(Math.round(t5.savings.fuelKwhPerYear * 10));
  });

  it('reads a catalogue saved with the company API field names', () => {
    const api = [
      {
        id: 'x',
        name: 'Roll',
        thicknessMm: 100,
        rollWidthMm: 1140,
        lanes: 3,
        rollLengthMm: 8300,
        coverageM2: 9.46,
        lambdaWmK: 0.044,
        unitPriceMinor: 2450,
        supplierCode: '',
        active: true,
      },
      {
        id: 'old',
        name: 'Old',
        thicknessMm: 100,
        rollWidthMm: 1140,
        lanes: 1,
        rollLengthMm: 8300,
        coverageM2: 9.46,
        lambdaWmK: 0.044,
        unitPriceMinor: 1,
        active: false,
      },
    ];
    expect(parseProductCatalogue(api)).toEqual([
      {
        id: 'x',
        name: 'Roll',
        thicknessMm: 100,
        rollWidthMm: 1140,
        lanesPerRoll: 3,
        rollLengthMm: 8300,
        coverageM2PerRoll: 9.46,
        lambda: 0.044,
        priceMinor: 2450,
      },
    ]);
  });

  it('throws the plan messages for a plan that fails the geometric checks', () => {
    const bad = planSchema.parse({
      ...JSON.parse(readFileSync(join(examples, 'rectangle.json'), 'utf8')),
      outline: [
        [0, 0],
        [6000, 0],
        [0, 4000],
        [6000, 4000],
      ],
      eavesEdges: [],
    });
    expect(() => computeTakeoff(bad, { products })).toThrow(InvalidPlanError);
    try {
      computeTakeoff(bad, { products });
    } catch (e) {
      expect((e as InvalidPlanError).errors[0].code).toBe('outline.self-intersection');
    }
  });

  it('computes the generated stress plan (400 points, 100 exclusions, about 600 m²) consistently', () => {
    const v = validatePlan(stressPlan());
    expect(v.ok).toBe(true);
    if (!v.ok) return;
    const t: Takeoff = computeTakeoff(v.plan, { products });
    expect(t.grossAreaM2).toBeGreaterThan(550);
    expect(t.grossAreaM2).toBeLessThan(650);
    expect(Math.abs(t.netAreaM2 - jstsNetAreaM2(v.plan))).toBeLessThanOrEqual(0.005 + 80 * 0.03 * Math.PI * 0.15 ** 2);
    const cross = t.layers.find((l) => l.role === 'cross')!;
    expect(cross.coveredAreaM2).toBeCloseTo(cross.areaM2, 1);
  });
});

describe('exclusions outside the outline', () => {
  it('are ignored by the counts and checks, flagged in the items and warned about', () => {
    const plan = loadExample('rectangle.json');
    const withOutside: Plan = {
      ...plan,
      exclusions: [
        ...plan.exclusions,
        { kind: 'downlight', at: [-2000, -2000] },
        {
          kind: 'tank',
          polygon: [
            [9000, 0],
            [9900, 0],
            [9900, 800],
            [9000, 800],
          ],
        },
      ],
    };
    const t = computeTakeoff(withOutside, { products });
    expect(t.exclusions.countsByKind.downlight).toBe(0);
    expect(t.exclusions.countsByKind.tank).toBe(0);
    expect(t.exclusions.items.map((i) => i.insideOutline)).toEqual([true, false, false]);
    expect(t.siteChecks.map((c) => c.code)).not.toContain('downlight.covers');
    expect(t.warnings.filter((w) => w.code === 'exclusion.outside-outline').map((w) => w.exclusionIndex)).toEqual([1, 2]);
    expect(t.netAreaM2).toBe(computeTakeoff(plan, { products }).netAreaM2);
  });
});

describe('edge cases', () => {
  it('copes with a loft that is boarded all over: no strips, no rolls, a boarded-area check', () => {
    const plan = loadExample('rectangle.json');
    const t = computeTakeoff({ ...plan, existing: { depthMm: 0, condition: 'none' }, exclusions: [{ kind: 'boarded', polygon: plan.outline }] }, { products });
    expect(t.netAreaM2).toBe(0);
    expect(t.layerAreaM2).toBe(0);
    for (const l of t.layers) {
      expect(l.strips).toEqual([]);
      expect(l.rollsByPacking).toBe(0);
      expect(l.rollsByArea).toBe(0);
      expect(l.wastePct).toBe(0);
    }
    expect(t.siteChecks.map((c) => c.code)).toContain('boarded.raise-or-leave');
    expect(t.savings.heatKwhPerYear).toBe(0);
  });

  it('proposes no layer when the existing insulation already meets the target', () => {
    const plan = loadExample('rectangle.json');
    const t = computeTakeoff({ ...plan, existing: { depthMm: 300, condition: 'good' } }, { products });
    expect(t.layers).toEqual([]);
    expect(t.uValueAfter).toBe(t.uValueBefore);
    expect(t.savings.moneyMinorPerYear).toBe(0);
    expect(t.warnings.map((w) => w.code)).toEqual(expect.arrayContaining(['target.below-existing', 'target.already-met']));
  });

  it('says so when the catalogue cannot reach the target', () => {
    const plan = loadExample('rectangle.json');
    const thin = products.filter((p) => p.thicknessMm === 100);
    const t = computeTakeoff(
      { ...plan, existing: { depthMm: 0, condition: 'none' }, target: { depthMm: 600 } },
      { products: thin, settings: { maxCrossLayers: 2 } },
    );
    expect(t.warnings.map((w) => w.code)).toContain('target.not-reached');
    expect(t.thermal.meetsTarget).toBe(false);
  });

  it('cuts a strip longer than a roll in butt-jointed pieces, none longer than a roll or shorter than the minimum usable length', () => {
    const t = computeTakeoff(loadExample('bungalow/main-loft.json'), { products });
    // 75 mm in 100 mm joists now takes a base layer first; the cross layer has the long strips.
    const layer = t.layers.find((l) => l.role === 'cross')!;
    const long = layer.strips.find((s) => s.lengthMm > layer.rollLengthMm)!;
    expect(long.pieces.length).toBeGreaterThanOrEqual(Math.ceil(long.lengthMm / layer.rollLengthMm));
    expect(long.pieces.reduce((n, p) => n + p.lengthMm, 0)).toBeCloseTo(long.lengthMm, 6);
    expect(long.pieces.every((p) => p.lengthMm <= layer.rollLengthMm && p.lengthMm >= DEFAULT_TAKEOFF_SETTINGS.minOffcutMm)).toBe(true);
  });
});
