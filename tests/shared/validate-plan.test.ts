import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { validatePlan, type PlanMessage } from '../../shared/plan/validate-plan';
import { PLAN_FORMAT, type PlanInput } from '../../shared/plan/plan-schema';

const examples = join(__dirname, '../../examples');

function base(over: Partial<PlanInput> = {}): PlanInput {
  return {
    format: PLAN_FORMAT,
    name: 'Test loft',
    outline: [
      [0, 0],
      [6000, 0],
      [6000, 4000],
      [0, 4000],
    ],
    eavesEdges: [0, 2],
    joists: { angleDeg: 90, centresMm: 400, widthMm: 47, depthMm: 100, offsetMm: 0 },
    exclusions: [
      {
        kind: 'hatch',
        polygon: [
          [2000, 1500],
          [2600, 1500],
          [2600, 2200],
          [2000, 2200],
        ],
      },
    ],
    ...over,
  };
}

function errorsOf(input: unknown): PlanMessage[] {
  const r = validatePlan(input);
  if (r.ok) throw new Error('expected the plan to be refused');
  return r.errors;
}

function warningsOf(input: unknown): PlanMessage[] {
  const r = validatePlan(input);
  if (!r.ok) throw new Error(`expected the plan to pass: ${r.errors[0].message}`);
  return r.warnings;
}

function listJson(dir: string): string[] {
  return readdirSync(dir).flatMap((n) =>
    statSync(join(dir, n)).isDirectory() ? listJson(join(dir, n)) : n.endsWith('.json') && n !== 'products.json' ? [join(dir, n)] : [],
  );
}

describe('validatePlan', () => {
  it('accepts a plain plan, fills in defaults and warns about nothing', () => {
    const r = validatePlan(base());
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.plan.eavesGapMm).toBe(50);
    expect(r.plan.target).toEqual({ depthMm: 270 });
    expect(r.plan.existing).toEqual({ depthMm: 0, condition: 'none' });
    expect(r.warnings).toEqual([]);
  });

  it.each(
    listJson(examples)
      .filter((f) => !f.includes('invalid'))
      .map((f) => [f.slice(examples.length + 1), f]),
  )('accepts the example %s', (_n, file) => {
    expect(validatePlan(JSON.parse(readFileSync(file, 'utf8'))).ok).toBe(true);
  });

  it('refuses the deliberately invalid example and says why, point by point', () => {
    const errs = errorsOf(JSON.parse(readFileSync(join(examples, 'invalid-crossed-outline.json'), 'utf8')));
    expect(errs.map((e) => e.code).sort()).toEqual([
      'eaves.edge-out-of-range',
      'joists.centres-not-above-width',
      'outline.self-intersection',
      'outline.zero-length-edge',
    ]);
    expect(errs.find((e) => e.code === 'outline.self-intersection')).toMatchObject({ edgeIndex: 1, otherEdgeIndex: 4 });
    expect(errs.find((e) => e.code === 'outline.zero-length-edge')).toMatchObject({ edgeIndex: 3, pointIndex: 4 });
    expect(errs.find((e) => e.code === 'eaves.edge-out-of-range')).toMatchObject({ edgeIndex: 7, path: 'eavesEdges.1' });
  });

  it.each([
    ['null', null, 'plan.not-an-object'],
    ['an array', [1, 2, 3], 'plan.not-an-object'],
    ['a string', 'quiltline-plan/1', 'plan.not-an-object'],
    ['no format', { name: 'x' }, 'format.unknown'],
    ['another format', { ...base(), format: 'quiltline-plan/9' }, 'format.unknown'],
  ])('refuses %s with one clear message', (_n, input, code) => {
    const errs = errorsOf(input);
    expect(errs).toHaveLength(1);
    expect(errs[0].code).toBe(code);
    expect(errs[0].message).toContain(PLAN_FORMAT);
  });

  it('names the unknown format it was given', () => {
    expect(errorsOf({ ...base(), format: 'roofplan/2' })[0].message).toBe('unknown plan format "roofplan/2": this version reads "quiltline-plan/1"');
  });

  it.each([
    ['no points', [], 0],
    ['one point', [[0, 0]], 1],
    [
      'two points',
      [
        [0, 0],
        [1000, 0],
      ],
      2,
    ],
  ])('refuses an outline with %s', (_n, outline, count) => {
    const errs = errorsOf(base({ outline: outline as PlanInput['outline'], eavesEdges: [] }));
    expect(errs[0]).toMatchObject({ code: 'outline.too-few-points', path: 'outline' });
    expect(errs[0].message).toContain(`has ${count} point`);
  });

  it('says which edges of a self-intersecting outline cross, and where', () => {
    const errs = errorsOf(
      base({
        outline: [
          [0, 0],
          [6000, 0],
          [0, 4000],
          [6000, 4000],
        ],
        eavesEdges: [],
      }),
    );
    expect(errs).toHaveLength(1);
    expect(errs[0]).toMatchObject({ code: 'outline.self-intersection', edgeIndex: 1, otherEdgeIndex: 3, at: [3000, 2000] });
    expect(errs[0].message).toBe('the outline crosses itself: edge 2 and edge 4 meet at (3000, 2000)'); // counted from 1, as the editor's buttons
  });

  it('refuses an outline that touches itself at a corner', () => {
    const figureEight = [
      [0, 0],
      [4000, 0],
      [4000, 2000],
      [2000, 2000],
      [2000, 4000],
      [6000, 4000],
      [6000, 2000],
      [2000, 2000],
      [0, 2000],
    ];
    expect(errorsOf(base({ outline: figureEight as PlanInput['outline'], eavesEdges: [] })).some((e) => e.code === 'outline.self-intersection')).toBe(true);
  });

  it('names a zero-length edge and the repeated point', () => {
    const errs = errorsOf(
      base({
        outline: [
          [0, 0],
          [6000, 0],
          [6000, 0],
          [6000, 4000],
          [0, 4000],
        ],
        eavesEdges: [],
      }),
    );
    expect(errs.map((e) => e.code)).toEqual(['outline.zero-length-edge']);
    expect(errs[0]).toMatchObject({ edgeIndex: 1, pointIndex: 2, at: [6000, 0] });
  });

  it.each([
    ['equal to the width', 47, 47],
    ['below the width', 40, 47],
  ])('refuses joist centres %s', (_n, centresMm, widthMm) => {
    const errs = errorsOf(base({ joists: { angleDeg: 0, centresMm, widthMm, depthMm: 100 } }));
    expect(errs.map((e) => e.code)).toEqual(['joists.centres-not-above-width']);
    expect(errs[0].path).toBe('joists.centresMm');
  });

  it('refuses an eaves edge that the outline does not have', () => {
    const errs = errorsOf(base({ eavesEdges: [0, 4] }));
    expect(errs).toEqual([expect.objectContaining({ code: 'eaves.edge-out-of-range', edgeIndex: 4, path: 'eavesEdges.1' })]);
  });

  it.each([
    [
      'metres typed as millimetres (too small)',
      [
        [0, 0],
        [6, 0],
        [6, 4],
        [0, 4],
      ],
      'outline.too-small',
    ],
    [
      'centimetres times a thousand (too large)',
      [
        [0, 0],
        [600000, 0],
        [600000, 400000],
        [0, 400000],
      ],
      'outline.too-large',
    ],
  ])('refuses an outline of insane size: %s', (_n, outline, code) => {
    expect(errorsOf(base({ outline: outline as PlanInput['outline'], exclusions: [], eavesEdges: [] })).map((e) => e.code)).toEqual([code]);
  });

  it('warns, without refusing, about an exclusion wholly outside the outline', () => {
    const ws = warningsOf(
      base({
        exclusions: [
          ...base().exclusions!,
          {
            kind: 'tank',
            polygon: [
              [9000, 9000],
              [9900, 9000],
              [9900, 9800],
              [9000, 9800],
            ],
          },
        ],
      }),
    );
    expect(ws).toEqual([expect.objectContaining({ code: 'exclusion.outside-outline', exclusionIndex: 1, path: 'exclusions.1' })]);
  });

  it('warns about an exclusion partly outside, but not about one flush with a wall', () => {
    const partly = warningsOf(
      base({
        exclusions: [
          ...base().exclusions!,
          {
            kind: 'boarded',
            polygon: [
              [5000, 1000],
              [7000, 1000],
              [7000, 2000],
              [5000, 2000],
            ],
          },
        ],
      }),
    );
    expect(partly.map((w) => w.code)).toEqual(['exclusion.partly-outside']);
    const flush = warningsOf(
      base({
        exclusions: [
          ...base().exclusions!,
          {
            kind: 'boarded',
            polygon: [
              [0, 0],
              [6000, 0],
              [6000, 1500],
              [0, 1500],
            ],
          },
        ],
      }),
    );
    expect(flush).toEqual([]);
  });

  it('warns about a downlight placed outside the outline', () => {
    const ws = warningsOf(base({ exclusions: [...base().exclusions!, { kind: 'downlight', at: [-500, 200] }] }));
    expect(ws.map((w) => w.code)).toEqual(['exclusion.outside-outline']);
  });

  it('refuses an exclusion that crosses itself and names it', () => {
    const errs = errorsOf(
      base({
        exclusions: [
          {
            kind: 'boarded',
            polygon: [
              [1000, 1000],
              [2000, 1000],
              [1000, 2000],
              [2000, 2000],
            ],
          },
        ],
      }),
    );
    expect(errs[0]).toMatchObject({ code: 'exclusion.self-intersection', exclusionIndex: 0, edgeIndex: 1, otherEdgeIndex: 3 });
  });

  it.each([
    [
      'a polygon and a point',
      {
        kind: 'tank',
        polygon: [
          [0, 0],
          [10, 0],
          [10, 10],
        ],
        at: [5, 5],
      },
    ],
    ['neither a polygon nor a point', { kind: 'tank' }],
    [
      'a polygon of two points',
      {
        kind: 'tank',
        polygon: [
          [0, 0],
          [10, 0],
        ],
      },
    ],
    ['an unknown kind', { kind: 'skylight', at: [5, 5] }],
  ])('refuses an exclusion with %s and points at it', (_n, exclusion) => {
    const errs = errorsOf(base({ exclusions: [exclusion as never] }));
    expect(errs[0].exclusionIndex).toBe(0);
    expect(errs[0].path).toMatch(/^exclusions\.0/);
  });

  it('refuses an exclusion of zero area', () => {
    const errs = errorsOf(
      base({
        exclusions: [
          {
            kind: 'other',
            polygon: [
              [1000, 1000],
              [2000, 1000],
              [3000, 1000],
            ],
          },
        ],
      }),
    );
    expect(errs.map((e) => e.code)).toContain('exclusion.zero-area');
  });

  it.each([
    [
      'a point that is not a pair of numbers',
      {
        outline: [
          [0, 0],
          [6000, 0],
          ['a', 4000],
          [0, 4000],
        ],
      },
      'outline.2.0',
      2,
    ],
    ['a negative joist depth', { joists: { angleDeg: 0, centresMm: 400, widthMm: 47, depthMm: -5 } }, 'joists.depthMm', undefined],
    ['a target with both depth and U-value', { target: { depthMm: 270, uValue: 0.16 } as never }, 'target', undefined],
    ['an unknown existing condition', { existing: { depthMm: 100, condition: 'soggy' as never } }, 'existing.condition', undefined],
    ['an eaves gap over 500 mm', { eavesGapMm: 800 }, 'eavesGapMm', undefined],
    ['an empty name', { name: '' }, 'name', undefined],
  ])('refuses %s with the path of the field', (_n, over, path, pointIndex) => {
    const errs = errorsOf(base(over as Partial<PlanInput>));
    expect(errs[0].path).toBe(path);
    expect(errs[0].message.startsWith(`${path}:`)).toBe(true);
    if (pointIndex !== undefined) expect(errs[0].pointIndex).toBe(pointIndex);
  });

  it('warns about unusual joist centres, a narrow eaves gap and a missing hatch', () => {
    expect(warningsOf(base({ joists: { angleDeg: 0, centresMm: 1500, widthMm: 47, depthMm: 100 } })).map((w) => w.code)).toEqual(['joists.unusual-centres']);
    expect(warningsOf(base({ eavesGapMm: 10 })).map((w) => w.code)).toEqual(['eaves.gap-narrow']);
    expect(warningsOf(base({ exclusions: [] })).map((w) => w.code)).toEqual(['hatch.missing']);
    expect(warningsOf(base({ eavesEdges: [0, 0] })).map((w) => w.code)).toEqual(['eaves.duplicate-edge']);
  });

  it('gives every message a code and a plain sentence', () => {
    const r = validatePlan(JSON.parse(readFileSync(join(examples, 'invalid-crossed-outline.json'), 'utf8')));
    expect(r.ok).toBe(false);
    if (r.ok) return;
    for (const m of [...r.errors, ...r.warnings]) {
      expect(m.code).toMatch(/^[a-z]+\.[a-z-]+$/);
      expect(m.message.length).toBeGreaterThan(10);
    }
  });
});
