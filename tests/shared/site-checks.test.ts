import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';

/*
 * Pre-start checks raised where the plan calls for them. Sources named in each message: HSE /
 * Control of Asbestos Regulations 2012; Wildlife and Countryside Act 1981 and Conservation of
 * Habitats and Species Regulations 2017; BS 5250:2021 (ventilation: high-level openings when the
 * span exceeds 10 m, the pitch exceeds 35° or the roof is mono-pitch); Approved Document F.
 */
const examples = join(__dirname, '../../examples');
const products = parseProductCatalogue(JSON.parse(readFileSync(join(examples, 'products.json'), 'utf8')));
const rectangle = JSON.parse(readFileSync(join(examples, 'rectangle.json'), 'utf8'));
const plan = (over: Record<string, unknown>): Plan => planSchema.parse({ ...rectangle, ...over });
const checks = (p: Plan) => computeTakeoff(p, { products }).siteChecks;
const codes = (p: Plan) => checks(p).map((c) => c.code);
const msg = (p: Plan, code: string) => checks(p).find((c) => c.code === code)?.message;

describe('site checks before work', () => {
  it('always raises asbestos/vermiculite and wildlife first, even when nothing else is needed', () => {
    const met = plan({ existing: { depthMm: 300, condition: 'good' } }); // already past 270 mm: no new layer
    const c = codes(met);
    expect(c.slice(0, 2)).toEqual(['asbestos.stop-and-test', 'wildlife.bats-birds']);
    expect(msg(met, 'asbestos.stop-and-test')).toMatch(/vermiculite.*stop.*tested.*licensed contractor/s);
    expect(msg(met, 'wildlife.bats-birds')).toMatch(/protected/);
    expect(c.at(-1)).toBe('local-regulations');
    expect(msg(met, 'local-regulations')).toMatch(/licensed practice come first/);
  });

  it('points the asbestos check at the flues and tanks on the plan', () => {
    const t = computeTakeoff(planSchema.parse(JSON.parse(readFileSync(join(examples, 'tank-hatch-downlights.json'), 'utf8'))), { products });
    expect(t.siteChecks.find((c) => c.code === 'asbestos.stop-and-test')!.message).toMatch(/1 flue and 1 tank/);
  });

  it('asks for pipe lagging where there is no tank, and speaks of no tank on the walkway', () => {
    const p = plan({});
    expect(codes(p)).toContain('pipes.lagging');
    expect(codes(p)).not.toContain('tank.no-insulation-beneath');
    expect(msg(p, 'walkway.boards-span-joists')).not.toMatch(/tank/);
    expect(codes(plan({ site: { waterPipes: false } }))).not.toContain('pipes.lagging');
  });

  it('asks for crawl boards once the cross layer hides the joists, and for sealing holes through the ceiling when insulating', () => {
    const p = plan({});
    expect(codes(p)).toEqual(expect.arrayContaining(['access.crawl-boards', 'ceiling.seal-holes']));
    const met = plan({ existing: { depthMm: 300, condition: 'good' } });
    expect(codes(met)).toContain('access.crawl-boards'); // the 300 mm already stands above the 100 mm joists
    expect(codes(met)).not.toContain('ceiling.seal-holes'); // nothing is laid
  });

  it('raises the transformer check with downlights, and the duct check when the survey notes extract-fan ducts', () => {
    const lights = plan({ exclusions: [...rectangle.exclusions, { kind: 'downlight', at: [1500, 1500] }] });
    expect(msg(lights, 'downlight.transformers')).toMatch(/If any downlight is low-voltage.*transformer on top of the insulation/);
    expect(
      codes(plan({ exclusions: [...rectangle.exclusions, { kind: 'downlight', at: [1500, 1500] }], site: { lowVoltageDownlights: false } })),
    ).not.toContain('downlight.transformers');
    expect(codes(plan({}))).not.toContain('extract.ducts');
    const ducts = plan({ site: { extractFanDucts: 2 } });
    expect(checks(ducts).find((c) => c.code === 'extract.ducts')).toMatchObject({ count: 2 });
    expect(msg(ducts, 'extract.ducts')).toMatch(/outside terminal.*Approved Document F/);
  });

  it('asks for high-level ventilation (BS 5250:2021) for a hipped roof, a pitch over 35° or a span over 10 m, not for the 5.2 m gable', () => {
    expect(codes(plan({}))).not.toContain('ventilation.high-level');
    expect(msg(plan({ roof: { shape: 'hipped' } }), 'ventilation.high-level')).toMatch(/hipped.*BS 5250:2021/);
    expect(msg(plan({ roof: { pitchDeg: 40 } }), 'ventilation.high-level')).toMatch(/40° \(over 35°\)/);
    // Joists at 90° run along y: the span is the outline's extent along y. A 10.4 m deep loft exceeds 10 m.
    const deep = plan({
      outline: [
        [0, 0],
        [8400, 0],
        [8400, 10400],
        [0, 10400],
      ],
    });
    expect(msg(deep, 'ventilation.high-level')).toMatch(/span is about 10\.4 m/);
  });
});
