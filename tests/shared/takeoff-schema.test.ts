import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
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

/**
 * The stored shape of each format, as a hash of the schema's JSON Schema. Stored artefacts are
 * recomputed at start-up only when their format differs from TAKEOFF_FORMAT, so a change of the
 * schema after a format has been released must come with a new format (and a new line here).
 */
const SHAPE_OF_FORMAT: Record<string, string> = {
  'quiltline-takeoff/2': '3a2d5e3bf6310b7f',
  'quiltline-takeoff/3': '5d50ff73a4de077a',
  'quiltline-takeoff/4': '86b6d11120890011',
};

describe('the takeoff artefact schema', () => {
  it('has the stored shape recorded for its format (a changed shape bumps TAKEOFF_FORMAT)', () => {
    const shape = createHash('sha256')
      .update(JSON.stringify(z.toJSONSchema(takeoffSchema)))
      .digest('hex')
      .slice(0, 16);
    expect({ [TAKEOFF_FORMAT]: shape }).toEqual({ [TAKEOFF_FORMAT]: SHAPE_OF_FORMAT[TAKEOFF_FORMAT] });
  });

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
    expect(stored.format).toBe('quiltline-takeoff/4');
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
