import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { PLAN_LIMITS, checkPlanCounts, impliedBays } from '../../shared/plan/plan-limits';
import { planSchema } from '../../shared/plan/plan-schema';
import { validatePlan } from '../../shared/plan/validate-plan';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { manyCornersPlan, manyDownlightsPlan, planAtTheLimits, tinyCentresPlan } from './helpers/big-plans';

const errorsOf = (input: unknown) => {
  const r = validatePlan(input);
  return r.ok ? [] : r.errors;
};

describe('plan size limits (validatePlan)', () => {
  it('refuses the 346-byte plan that stalled the server: 99 m at 0.4 mm joist centres, naming joists.centresMm', () => {
    expect(JSON.stringify(tinyCentresPlan()).length).toBeLessThan(400);
    const errors = errorsOf(tinyCentresPlan());
    expect(errors).toEqual([expect.objectContaining({ code: 'limits.too-many-bays', path: 'joists.centresMm' })]);
    expect(errors[0].message).toMatch(/247,500 bays/);
  });

  it('counts the bays across the joists, whatever their angle (10 m across at 400 mm is 25 bays)', () => {
    const square = [
      [0, 0],
      [10_000, 0],
      [10_000, 6_000],
      [0, 6_000],
    ];
    expect(impliedBays(square, { angleDeg: 90, centresMm: 400 })).toBe(25);
    expect(impliedBays(square, { angleDeg: 0, centresMm: 400 })).toBe(15);
  });

  it('refuses 100,000 outline corners and 5,000 downlights by counting, before parsing them', () => {
    const corners = errorsOf(manyCornersPlan(100_000));
    expect(corners).toEqual([expect.objectContaining({ code: 'limits.too-many', path: 'outline' })]);
    expect(corners[0].message).toMatch(/100,000 corners.*at most 500/);
    // The counts alone decide: even outline points that are not points at all are not looked at.
    expect(checkPlanCounts({ outline: Array(PLAN_LIMITS.outlineCorners + 1).fill('not a point') })).toHaveLength(1);
    expect(errorsOf(manyDownlightsPlan(5_000))).toEqual([expect.objectContaining({ code: 'limits.too-many', path: 'exclusions' })]);
  });

  it('refuses an exclusion with too many corners, naming that exclusion, and too many corners altogether', () => {
    const plan = { ...manyDownlightsPlan(2), exclusions: [{ kind: 'tank', polygon: Array(PLAN_LIMITS.exclusionCorners + 1).fill([1, 1]) }] };
    expect(errorsOf(plan)).toEqual([expect.objectContaining({ path: 'exclusions.0.polygon' })]);
    const many = Array.from({ length: 30 }, () => ({ kind: 'tank', polygon: Array(PLAN_LIMITS.exclusionCorners).fill([1, 1]) }));
    expect(errorsOf({ ...manyDownlightsPlan(2), exclusions: many })).toEqual([expect.objectContaining({ path: 'exclusions' })]);
  });

  it('refuses coordinates and joist offsets beyond 10 km (a huge offset made the bay loop never end)', () => {
    const plan = { ...manyDownlightsPlan(1), joists: { angleDeg: 90, centresMm: 400, widthMm: 47, depthMm: 100, offsetMm: 1e300 } };
    expect(errorsOf(plan)).toEqual([expect.objectContaining({ path: 'joists.offsetMm' })]);
    expect(
      planSchema.safeParse({
        ...manyDownlightsPlan(1),
        outline: [
          [0, 0],
          [1e12, 0],
          [0, 1e12],
        ],
      }).success,
    ).toBe(false);
  });

  it('keeps the schema itself bounded too (the editor and stored plans read through it)', () => {
    expect(planSchema.safeParse(manyCornersPlan(PLAN_LIMITS.outlineCorners + 1)).success).toBe(false);
    expect(planSchema.safeParse(manyDownlightsPlan(PLAN_LIMITS.exclusions + 1)).success).toBe(false);
  });

  it('accepts a plan at every limit at once, and computes its takeoff in bounded time', () => {
    const v = validatePlan(planAtTheLimits());
    expect(v.ok).toBe(true);
    if (!v.ok) return;
    expect(v.plan.outline).toHaveLength(PLAN_LIMITS.outlineCorners);
    expect(v.plan.exclusions).toHaveLength(PLAN_LIMITS.exclusions);
    const started = performance.now();
    const products = parseProductCatalogue(JSON.parse(fs.readFileSync(path.join(__dirname, '../../examples/products.json'), 'utf8')));
    const t = computeTakeoff(v.plan, { products });
    // The server's default time limit is 10 s; on an idle core this takes about 2 s.
    expect(performance.now() - started).toBeLessThan(10_000);
    expect(t.netAreaM2).toBeGreaterThan(2_000);
    // Every bay is worked out: at 61 mm centres a 47 mm joist leaves 14 mm bays, narrower than any
    // numbered strip, so they come out as pieces to fill from offcuts rather than as strips.
    const base = t.layers.find((l) => l.role === 'base')!;
    expect(base.strips.length + base.fills.length).toBeGreaterThan(PLAN_LIMITS.bays / 2);
  });
});
