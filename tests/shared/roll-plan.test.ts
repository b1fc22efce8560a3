import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { planRolls, rollsByArea, type PieceDemand, type RollStock } from '../../shared/takeoff/roll-plan';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { planSchema, type PlanInput } from '../../shared/plan/plan-schema';
import { jobRollsByProduct } from '../../shared/takeoff/job-roll-plan';

const products = parseProductCatalogue(JSON.parse(readFileSync(join(__dirname, '../../examples/products.json'), 'utf8')));
const settings = { minOffcutMm: 500, minStripWidthMm: 100 };
const stock = (rollLengthMm: number, lanesPerRoll = 1, laneWidthMm = 1140): RollStock => ({
  productId: 'p',
  rollLengthMm,
  lanesPerRoll,
  laneWidthMm,
  coverageM2PerRoll: (rollLengthMm * laneWidthMm * lanesPerRoll) / 1e6,
});
const strips = (lengths: number[], widthMm = 1140): PieceDemand[] =>
  lengths.map((lengthMm, i) => ({ key: `S${i + 1}`, group: 'g', lengthMm, widthMm, areaMm2: lengthMm * widthMm, kind: 'strip' }));

/** A plan drawn for a hand count: a polygon outline, joists at 90° (along y) unless given, no eaves. */
const drawn = (outline: [number, number][], over: Partial<PlanInput> = {}) =>
  planSchema.parse({
    format: 'quiltline-plan/1',
    name: 'hand count',
    outline,
    eavesEdges: [],
    joists: { angleDeg: 90, centresMm: 400, widthMm: 47, depthMm: 100, offsetMm: 0 },
    exclusions: [],
    existing: { depthMm: 100, condition: 'good' },
    target: { depthMm: 270 },
    ...over,
  });
const only = (...ids: string[]) => products.filter((p) => ids.includes(p.id));

describe('rule-of-thumb roll count (common practice: area × (1 + waste) / roll coverage)', () => {
  it('48 m² with 10% waste and 7.0 m² per roll needs ceil(7.54) = 8 rolls', () => {
    expect(rollsByArea(48, 10, 7.0)).toBe(8);
  });

  it.each([
    [0, 10, 7, 0],
    [7, 0, 7, 1],
    [7.0001, 0, 7, 2],
    [42.42, 10, 5.7, 9],
  ])('area %s m², waste %s%%, %s m² per roll → %s rolls', (area, waste, cover, rolls) => {
    expect(rollsByArea(area, waste, cover)).toBe(rolls);
  });
});

describe('lanes laid continuously (bay method: total bay length ÷ roll length, common practice, as retail how-to guides show it)', () => {
  it('12 bays × 8 m with 8 m rolls → 12 rolls, nothing left', () => {
    const [p] = planRolls([{ stock: stock(8000), pieces: strips(Array(12).fill(8000)) }], settings);
    expect(p.rolls).toBe(12);
    expect(p.wastePct).toBe(0);
  });

  it('12 bays × 8 m with 5.3 m rolls → the leaflet’s 96 / 5.3 = 18.1 → 19 rolls: each roll’s end butts into the next bay', () => {
    const [p] = planRolls([{ stock: stock(5300), pieces: strips(Array(12).fill(8000)) }], settings);
    expect(p.rolls).toBe(19);
    // Every piece at least the minimum usable length, no lane past its end.
    for (const l of p.lanes) {
      expect(l.usedMm).toBeLessThanOrEqual(5300 + 1e-6);
      for (const c of l.cuts) expect(c.lengthMm).toBeGreaterThanOrEqual(500);
    }
  });

  it('a lane end too short for the next strip takes a later short strip; shorter ends are kept for filling', () => {
    // 8300 lanes: 7000 leaves 1300; the 800 strip goes there (not the next 7000), leaving 500.
    const [p] = planRolls([{ stock: stock(8300), pieces: strips([7000, 7000, 800]) }], settings);
    expect(p.lanes.map((l) => l.cuts.map((c) => `${c.key} ${c.lengthMm}`))).toEqual([
      ['S1 7000', 'S2 1300'],
      ['S2 5700', 'S3 800'],
    ]);
    expect(p.rolls).toBe(2);
  });

  it('never leaves a butt-jointed piece shorter than the minimum usable length', () => {
    // 8300 lane, 8000 first: 300 left is too short to start the 4000 strip: a new lane.
    const [p] = planRolls([{ stock: stock(8300), pieces: strips([8000, 4000]) }], settings);
    expect(p.lanes.map((l) => l.cuts.map((c) => c.lengthMm))).toEqual([[8000], [4000]]);
    // 4300 left of 8300 after 4000; a 4600 strip is cut 4100 + 500, not 4300 + 300.
    const [q] = planRolls([{ stock: stock(8300), pieces: strips([4000, 4600]) }], settings);
    expect(q.lanes.map((l) => l.cuts.map((c) => c.lengthMm))).toEqual([[4000, 4100], [500]]);
  });

  it('a narrow strip comes from the lengthwise rest of a lane cut for another narrow strip', () => {
    const pieces: PieceDemand[] = [
      { key: 'N1', group: 'g', lengthMm: 3000, widthMm: 500, areaMm2: 3000 * 500, kind: 'strip' },
      { key: 'N2', group: 'g', lengthMm: 3000, widthMm: 400, areaMm2: 3000 * 400, kind: 'strip' },
    ];
    const [p] = planRolls([{ stock: stock(5000), pieces }], settings);
    expect(p.lanes).toHaveLength(1);
    expect(p.lanes[0].cuts).toEqual([expect.objectContaining({ key: 'N1', lengthMm: 3000, widthMm: 500 })]);
    expect(p.fromOffcuts).toEqual([expect.objectContaining({ key: 'N2', lengthMm: 3000, widthMm: 400, from: 'lengthwise rest of N1' })]);
  });

  it('fills slivers from offcuts by area, buying material only for what the offcuts cannot cover', () => {
    const fill = (areaMm2: number): PieceDemand => ({ key: 'F', group: 'g', lengthMm: 1000, widthMm: 60, areaMm2, kind: 'fill' });
    // 4800 in a 5000 lane leaves 200 × 1140 = 0.228 m²: a 0.2 m² sliver fits, a 0.3 m² one needs 70/1140 m more.
    const [a] = planRolls([{ stock: stock(5000), pieces: [...strips([4800]), fill(200_000)] }], settings);
    expect(a.lanesUsed).toBe(1);
    const [b] = planRolls([{ stock: stock(5000), pieces: [...strips([4800]), fill(300_000)] }], settings);
    expect(b.lanesUsed).toBe(2);
    expect(b.lanes[1].cuts[0]).toEqual(expect.objectContaining({ key: 'fill', lengthMm: 70 }));
  });

  it('pools the groups given (layers, spaces) and counts the rolls each one opens', () => {
    const pieces = [...strips([3000, 3000]).map((p) => ({ ...p, group: 'main' })), ...strips([2000]).map((p) => ({ ...p, key: 'G1', group: 'garage' }))];
    const [p] = planRolls([{ stock: stock(8300, 1), pieces }], settings);
    // 3000 + 3000 + 2000 = 8000 ≤ 8300: one roll for both spaces, opened by the main loft.
    expect(p.rolls).toBe(1);
    expect(p.rollsByGroup).toEqual({ main: 1, garage: 0 });
  });
});

describe('roll plan properties (random cut lists)', () => {
  it('cuts every strip exactly once, no lane beyond its length, buys at least the area covered', () => {
    const arbPiece = fc.record({
      lengthMm: fc.integer({ min: 10, max: 2000 }).map((x) => x * 10),
      narrow: fc.boolean(),
      widthMm: fc.integer({ min: 10, max: 113 }).map((x) => x * 10),
      fill: fc.integer({ min: 0, max: 9 }),
    });
    fc.assert(
      fc.property(fc.array(arbPiece, { minLength: 1, maxLength: 50 }), fc.integer({ min: 1, max: 3 }), (raw, lanes) => {
        const W = 1140 / lanes;
        const pieces: PieceDemand[] = raw.map((r, i) => {
          const widthMm = r.narrow ? Math.min(W, r.widthMm) : W;
          return { key: `S${i}`, group: 'g', lengthMm: r.lengthMm, widthMm, areaMm2: r.lengthMm * widthMm * 0.95, kind: r.fill === 0 ? 'fill' : 'strip' };
        });
        const [p] = planRolls([{ stock: stock(8300, lanes, W), pieces }], settings);
        const got = new Map<string, number>();
        for (const l of p.lanes) {
          let at = 0;
          for (const c of l.cuts) {
            expect(c.offsetMm).toBeCloseTo(at, 6);
            at += c.lengthMm;
            got.set(c.key, (got.get(c.key) ?? 0) + c.lengthMm);
          }
          expect(l.usedMm).toBeLessThanOrEqual(8300 + 1e-6);
        }
        for (const c of p.fromOffcuts) got.set(c.key, (got.get(c.key) ?? 0) + c.lengthMm);
        for (const s of pieces.filter((x) => x.kind === 'strip')) expect(got.get(s.key)).toBeCloseTo(s.lengthMm, 6);
        expect(p.boughtMm2).toBeGreaterThanOrEqual(p.coveredMm2);
        expect(p.rolls).toBeGreaterThanOrEqual(p.rollsLowerBound);
        expect(p.rolls).toBe(Math.ceil(p.lanesUsed / lanes));
      }),
      { numRuns: 300 },
    );
  });
});

describe('hand-worked counts on drawn plans', () => {
  it('eleven 4.8 m bays, 8.3 m lanes split 3 per roll: 52.8 m ÷ 8.3 m = 6.4 → 7 lanes → 3 rolls (not one lane per bay, 11 lanes → 4 rolls)', () => {
    // Joists along y at 400 centres from x = 0: 11 bays of 353 mm between x = 0 and 4400, each 4800 long.
    const plan = drawn(
      [
        [0, 0],
        [4400, 0],
        [4400, 4800],
        [0, 4800],
      ],
      { existing: { depthMm: 0, condition: 'none' }, target: { depthMm: 100 } },
    );
    const t = computeTakeoff(plan, { products: only('wool-100-s3') });
    const base = t.layers[0];
    expect(t.layers.map((l) => l.role)).toEqual(['base']);
    expect(base.strips.map((s) => s.lengthMm)).toEqual(Array(11).fill(4800));
    expect(base.packing.lanesUsed).toBe(7);
    expect(base.rollsByPacking).toBe(3);
    // Rule of thumb: 4.4 × 4.8 = 21.12 m² × 1.1 / 9.46 = 2.46 → 3. Lower bound: 11 × 0.353 × 4.8 = 18.64 m² / 9.46 → 2.
    expect(base.rollsByArea).toBe(3);
    expect(base.rollsLowerBound).toBe(2);
  });

  it('a 5.0 × 3.42 m room, cross rolls 1140 × 5000: three whole lanes → 3 rolls (rule of thumb 17.1 × 1.1 / 5.7 = 3.3 → 4)', () => {
    const plan = drawn([
      [0, 0],
      [5000, 0],
      [5000, 3420],
      [0, 3420],
    ]);
    const t = computeTakeoff(plan, { products: only('wool-100-s3', 'wool-170') });
    const cross = t.layers.find((l) => l.role === 'cross')!;
    expect(cross.strips.map((s) => [s.lengthMm, s.widthMm])).toEqual([
      [5000, 1140],
      [5000, 1140],
      [5000, 1140],
    ]);
    expect(cross.rollsByPacking).toBe(3);
    expect(cross.rollsByArea).toBe(4);
  });

  it('an L: the lane across the inside corner is full width for 2.5 m and 570 mm wide beyond the wall, cut lengthwise → 3 rolls', () => {
    // 5000 × 1710 plus 2500 × 1710: lanes of 1140 from one side: 5000 full; 2500 full + 2500 × 570; 2500 full.
    // Full-width lengths 5000 + 2500 + 2500 = 10 000 → two 5000 lanes; the 570 × 2500 piece from a third lane cut lengthwise.
    const plan = drawn([
      [0, 0],
      [5000, 0],
      [5000, 1710],
      [2500, 1710],
      [2500, 3420],
      [0, 3420],
    ]);
    const t = computeTakeoff(plan, { products: only('wool-100-s3', 'wool-170') });
    const cross = t.layers.find((l) => l.role === 'cross')!;
    const pieces = cross.strips.flatMap((s) => s.pieces);
    expect(pieces.filter((p) => p.source !== 'lane').map((p) => `${p.lengthMm}×${p.widthMm} ${p.source}`)).toEqual(['2500×570 lengthwise']);
    expect(pieces.filter((p) => p.source === 'lane').reduce((n, p) => n + p.lengthMm, 0)).toBe(10_000);
    expect(cross.rollsByPacking).toBe(3);
    // Area 12.825 m²: lower bound 12.825 / 5.7 = 2.25 → 3; rule of thumb × 1.1 = 2.47 → 3.
    expect(cross.rollsLowerBound).toBe(3);
    expect(cross.rollsByArea).toBe(3);
  });

  it('a sloping wall: lanes end on the angle and count at their true (middle) length, 4750 and 4250 → 2 rolls', () => {
    // Right wall from (5000, 0) to (4000, 2280): the lane y 0–1140 runs 5000 → 4500 (middle 4750), y 1140–2280 runs 4500 → 4000 (4250).
    const plan = drawn([
      [0, 0],
      [5000, 0],
      [4000, 2280],
      [0, 2280],
    ]);
    const t = computeTakeoff(plan, { products: only('wool-100-s3', 'wool-170') });
    const cross = t.layers.find((l) => l.role === 'cross')!;
    expect(cross.strips.map((s) => s.lengthMm).sort()).toEqual([4250, 4750]);
    expect(cross.strips.map((s) => s.extentMm).sort()).toEqual([4500, 5000]);
    expect(cross.rollsByPacking).toBe(2);
  });

  it('a 60 mm last lane is not a strip: filled from the 200 mm lane ends, 2 rolls (rule of thumb 11.23 × 1.1 / 5.7 = 2.2 → 3)', () => {
    // 4800 × 2340: two 1140 lanes and 60 mm; each 4800 strip leaves 200 × 1140 = 0.228 m² of its 5000 roll.
    const plan = drawn([
      [0, 0],
      [4800, 0],
      [4800, 2340],
      [0, 2340],
    ]);
    const t = computeTakeoff(plan, { products: only('wool-100-s3', 'wool-170') });
    const cross = t.layers.find((l) => l.role === 'cross')!;
    expect(cross.strips).toHaveLength(2);
    expect(cross.fills).toEqual([expect.objectContaining({ areaM2: 0.288, widthMm: 60 })]);
    expect(cross.rollsByPacking).toBe(2);
    expect(cross.rollsByArea).toBe(3);
  });

  it('rounds to 10 mm steps with a 1 mm tolerance: 4000.4 mm is cut at 4000, 4001.5 mm at 4010', () => {
    const at = (w: number) =>
      computeTakeoff(
        drawn([
          [0, 0],
          [w, 0],
          [w, 1140],
          [0, 1140],
        ]),
        { products: only('wool-100-s3', 'wool-170') },
      ).layers.find((l) => l.role === 'cross')!.strips[0].lengthMm;
    expect(at(4000.4)).toBe(4000);
    expect(at(4001.5)).toBe(4010);
  });
});

describe('every example: packed against the rule of thumb and the lower bound', () => {
  const dir = join(__dirname, '../../examples');
  const files = [
    'angled-walls.json',
    'bungalow/garage-loft.json',
    'bungalow/main-loft.json',
    'eaves-two-sides.json',
    'l-shape.json',
    'rectangle.json',
    't-shape-chimney.json',
    'tank-hatch-downlights.json',
  ];
  it.each(files)('%s: never above the rule of thumb, within one roll of the lower bound, strip material within 5%% of area + friction fit', (name) => {
    const t = computeTakeoff(planSchema.parse(JSON.parse(readFileSync(join(dir, name), 'utf8'))), { products });
    for (const rp of t.rollPlan) {
      expect(rp.rolls).toBeLessThanOrEqual(rp.rollsByArea);
      expect(rp.rolls - rp.rollsLowerBound).toBeLessThanOrEqual(1);
    }
    for (const l of t.layers) {
      // Material cut for the strips against what they cover plus the waste they truly cause: a base
      // lane wider than its bay is squeezed in (lane − bay) × length, holes cut round obstacles.
      const material = l.strips.reduce((n, s) => n + s.pieces.reduce((m, p) => m + p.lengthMm * p.widthMm, 0), 0) / 1e6;
      const covered = l.strips.reduce((n, s) => n + s.areaM2, 0);
      const holes = l.strips.reduce((n, s) => n + s.cutOutM2, 0);
      const friction = l.role === 'base' ? l.strips.reduce((n, s) => n + (s.lengthMm * Math.max(0, l.laneWidthMm - l.bandWidthMm)) / 1e6, 0) : 0;
      expect(material).toBeLessThanOrEqual((covered + friction + holes) * 1.05);
      expect(material).toBeGreaterThanOrEqual(covered * 0.99);
    }
  });
});

describe('rolls pooled over the spaces of a job', () => {
  it('never buys more than the spaces’ own plans added up, and reuses one space’s roll ends in another', () => {
    const dir = join(__dirname, '../../examples');
    const load = (f: string) => computeTakeoff(planSchema.parse(JSON.parse(readFileSync(join(dir, f), 'utf8'))), { products: only('wool-100-s3', 'wool-170') });
    // The same 2.5 × 1.14 m room twice: alone each opens a 5 m roll of 170 mm for one 2.5 m strip; together one roll does.
    const room = computeTakeoff(
      drawn([
        [0, 0],
        [2500, 0],
        [2500, 1140],
        [0, 1140],
      ]),
      { products: only('wool-100-s3', 'wool-170') },
    );
    const pooled = jobRollsByProduct([room, room, load('bungalow/garage-loft.json')]);
    const own = new Map<string, number>();
    for (const t of [room, room, load('bungalow/garage-loft.json')])
      for (const l of t.layers) own.set(l.productId, (own.get(l.productId) ?? 0) + l.rollsByPacking);
    for (const [id, n] of pooled) expect(n).toBeLessThanOrEqual(own.get(id)!);
    expect(pooled.get('wool-170')).toBeLessThan(own.get('wool-170')!);
  });
});
