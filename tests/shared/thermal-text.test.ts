import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { planSchema } from '../../shared/plan/plan-schema';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { thermalFactsText, thermalTargetText } from '../../shared/takeoff/thermal-text';

// The line the quote, job sheet and handover PDFs print: every figure named, and the one the target is judged on.
const examples = join(__dirname, '../../examples');
const products = parseProductCatalogue(JSON.parse(readFileSync(join(examples, 'products.json'), 'utf8')));
const plan = (file: string, over: Record<string, unknown> = {}) => planSchema.parse({ ...JSON.parse(readFileSync(join(examples, file), 'utf8')), ...over });

describe('thermal facts for documents', () => {
  it('names the ISO 6946 insulated-area and whole-ceiling figures, the RdSAP default, before → after, to two decimals', () => {
    const t = computeTakeoff(plan('eaves-two-sides.json'), { products });
    const text = thermalFactsText(t);
    expect(text).toContain(`U-value (BS EN ISO 6946 combined method) ${t.uValueBefore.toFixed(2)} → ${t.uValueAfter.toFixed(2)} W/m²K insulated area`);
    expect(text).toContain(`${t.uValueBeforeWholeCeiling.toFixed(2)} → ${t.uValueAfterWholeCeiling.toFixed(2)} whole ceiling`);
    // RdSAP 2012 Table S9: the existing 100 mm good → 0.40 before.
    expect(text).toContain(`RdSAP 2012 Table S9 default 0.40 → ${t.thermal.after.rdsapU.toFixed(2)}`);
  });

  it('says which figure a U-value target is judged on, and whether it is met', () => {
    const whole = computeTakeoff(plan('eaves-two-sides.json'), { products });
    expect(thermalTargetText(whole)).toBe(`target U 0.16 W/m²K judged on the whole ceiling (ISO 6946): ${whole.thermal.meetsTarget ? 'met' : 'not met'}`);
    const part = computeTakeoff(plan('eaves-two-sides.json'), { products, settings: { targetBasis: 'insulated-area' } });
    expect(thermalTargetText(part)).toContain('judged on the insulated area');
    // An unreachable target is reported as not met, never left out.
    const far = computeTakeoff(plan('eaves-two-sides.json', { target: { uValue: 0.02 } }), { products });
    expect(thermalTargetText(far)).toBe('target U 0.02 W/m²K judged on the whole ceiling (ISO 6946): not met');
    const depth = computeTakeoff(plan('eaves-two-sides.json', { target: { depthMm: 270 } }), { products });
    expect(thermalTargetText(depth)).toBe(`target 270 mm of insulation: ${depth.thermal.meetsTarget ? 'met' : 'not met'}`);
  });
});
