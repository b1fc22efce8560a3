import { describe, expect, it } from 'vitest';
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { validatePlan } from '../../shared/plan/validate-plan';
import { computeTakeoff, TAKEOFF_FORMAT } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { readStoredTakeoff, takeoffSchema } from '../../shared/takeoff/takeoff-schema';

const examples = join(__dirname, '../../examples');
const products = parseProductCatalogue(JSON.parse(readFileSync(join(examples, 'products.json'), 'utf8')));

function planFiles(dir: string): string[] {
  return readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    if (statSync(p).isDirectory()) return planFiles(p);
    return n.endsWith('.json') && n !== 'products.json' && !n.includes('invalid') ? [p] : [];
  });
}
const files = planFiles(examples);

describe('the takeoff artefact schema', () => {
  it('finds the example plans', () => expect(files.length).toBeGreaterThanOrEqual(8));

  it.each(files.map((f) => [f.slice(examples.length + 1), f]))('%s: computeTakeoff output parses to itself (no field missing from the schema)', (_n, f) => {
    const v = validatePlan(JSON.parse(readFileSync(f, 'utf8')));
    if (!v.ok) throw new Error(v.errors[0].message);
    // Through JSON, as it is stored in a JSONB column.
    const stored = JSON.parse(JSON.stringify(computeTakeoff(v.plan, { products })));
    const parsed = takeoffSchema.safeParse(stored);
    expect(parsed.success ? null : parsed.error.issues.slice(0, 3)).toBeNull();
    // Unknown keys are stripped by the parse: equality shows the schema names every field.
    expect(parsed.data).toEqual(stored);
    expect(stored.format).toBe('quiltline-takeoff/2');
  });

  it('records the product choice: chosen from the catalogue, or pinned in the plan', () => {
    const v = validatePlan(JSON.parse(readFileSync(join(examples, 'rectangle.json'), 'utf8')));
    if (!v.ok) throw new Error('rectangle.json');
    const auto = computeTakeoff(v.plan, { products });
    expect(auto.productChoice.source).toBe('catalogue');
    expect(auto.productChoice.crossProductIds).toEqual(auto.layers.filter((l) => l.role === 'cross').map((l) => l.productId));
    const crossId = products.find((p) => !p.roles || p.roles.includes('cross'))!.id;
    const pinned = computeTakeoff({ ...v.plan, products: { crossProductIds: [crossId] } }, { products });
    expect(pinned.productChoice).toEqual(expect.objectContaining({ source: 'plan', crossProductIds: [crossId] }));
  });

  it('reads neither an older format nor a broken value as a takeoff', () => {
    const v = validatePlan(JSON.parse(readFileSync(join(examples, 'l-shape.json'), 'utf8')));
    if (!v.ok) throw new Error('l-shape.json');
    const t = JSON.parse(JSON.stringify(computeTakeoff(v.plan, { products })));
    expect(readStoredTakeoff(t)?.format).toBe(TAKEOFF_FORMAT);
    expect(readStoredTakeoff({ ...t, format: 'quiltline-takeoff/1' })).toBeNull();
    expect(readStoredTakeoff({ ...t, layers: [{ ...t.layers[0], strips: [{ ...t.layers[0].strips[0], polygons: undefined }] }] })).toBeNull();
    expect(readStoredTakeoff(null)).toBeNull();
    expect(readStoredTakeoff({ format: TAKEOFF_FORMAT })).toBeNull();
  });
});
