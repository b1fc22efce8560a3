import { describe, expect, it } from 'vitest';
import { setExisting } from '../../src/editor/commands/set-existing';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { rectPlan } from './fixtures';

const products = parseProductCatalogue(JSON.parse(readFileSync(join(__dirname, '../../examples/products.json'), 'utf8')));
const empty = () => ({ ...rectPlan(), existing: { depthMm: 0, condition: 'none' as const } });

describe('existing insulation in the editor: a typed depth always has a condition', () => {
  it('a depth typed over "none" takes the condition "good", so it counts (U before falls from about 2.5 to about 0.4)', () => {
    const before = computeTakeoff(empty(), { products });
    const p = setExisting(empty(), { depthMm: 100 });
    expect(p.existing).toEqual({ depthMm: 100, condition: 'good' });
    const after = computeTakeoff(p, { products });
    // Bare ceiling: 1 / (0.10 + 0.0125/0.21 + 0.20 + 0.04) = 2.50 W/m²K; 100 mm of good wool between joists ≈ 0.39 W/m²K.
    expect(before.uValueBefore).toBeCloseTo(2.5, 1);
    expect(after.uValueBefore).toBeGreaterThan(0.35);
    expect(after.uValueBefore).toBeLessThan(0.45);
  });

  it('keeps a condition the estimator chose when the depth changes', () => {
    const p = setExisting(setExisting(empty(), { depthMm: 100, condition: 'patchy' }), { depthMm: 150 });
    expect(p.existing).toEqual({ depthMm: 150, condition: 'patchy' });
  });

  it('a depth of 0 means none, and choosing "none" clears the depth', () => {
    expect(setExisting(rectPlan(), { depthMm: 0 }).existing.condition).toBe('none');
    expect(setExisting(rectPlan(), { condition: 'none' }).existing.depthMm).toBe(0);
  });
});
