// Company takeoff rules from the settings page reach the stored takeoff: the eaves mode for plans that do not choose, and the hatch kit's lid insulation.
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { readStoredTakeoff } from '../../shared/takeoff/takeoff-schema';
import { PlanRevision } from '../../server/db/models';
import { seedDemoCatalogue } from '../../server/modules/settings/settings.service';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

// examples/eaves-two-sides.json: 10.2 × 6.4 m, eaves on the two 10,200 mm edges, joists at 600 mm, no roof given, one hatch, no eavesMode.
const plan = (): Plan => planSchema.parse(JSON.parse(fs.readFileSync(path.join(__dirname, '..', '..', 'examples', 'eaves-two-sides.json'), 'utf8')));

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  await seedDemoCatalogue(org.id);
});
afterAll(async () => ctx?.close());

async function settingsBody(office: Awaited<ReturnType<typeof loginAs>>) {
  const { hasLogo: _ignored, ...body } = (await office.get('/api/settings')).body.settings;
  return body;
}

async function storedTakeoffOfNewSpace(p: Plan) {
  const { job } = await createJob(org);
  const estimator = await loginAs(ctx.app, org.estimator);
  const res = await estimator.post(`/api/jobs/${job.id}/spaces`).send({ name: 'Main loft', plan: p });
  expect(res.status).toBe(201);
  const row = await PlanRevision.findOne({ where: { spaceId: res.body.space.id } });
  return { job, takeoff: readStoredTakeoff(row?.takeoff)! };
}

describe('company eaves mode', () => {
  it('starts as a gap, refuses an unknown mode by name, and counts ventilators on a plan that did not choose once set to ventilators', async () => {
    const office = await loginAs(ctx.app, org.office);
    const body = await settingsBody(office);
    expect(body.eavesMode).toBe('gap');
    const before = await storedTakeoffOfNewSpace(plan());
    expect(before.takeoff.eaves.mode).toBe('gap');
    expect(before.takeoff.eaves.ventilatorCount).toBe(0);

    const bad = await office.put('/api/settings').send({ ...body, eavesMode: 'trays' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toContain('eavesMode');
    expect((await office.put('/api/settings').send({ ...body, eavesMode: 'ventilators' })).status).toBe(200);

    const { job, takeoff } = await storedTakeoffOfNewSpace(plan());
    expect(takeoff.eaves.mode).toBe('ventilators');
    // One ventilator per rafter space along each eaves edge (rafters taken at the 600 mm joist centres):
    // ⌈10,200 / 600⌉ = 17 per edge, two edges → 34.
    expect(takeoff.eaves.ventilatorCount).toBe(34);
    // With ventilators the insulation runs over the wall plate: no eaves strip is kept back.
    expect(takeoff.eavesBandAreaM2).toBe(0);
    expect(takeoff.siteChecks.map((c) => c.code)).toContain('eaves.ventilators');
    // The quote prices the same count of eaves trays.
    const quote = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
    const trays = quote.lines.find((l: { extraKind?: string }) => l.extraKind === 'eaves_tray');
    expect(trays?.quantity).toBe(34);

    // A plan that chooses keeps its own choice over the company's.
    const own = await storedTakeoffOfNewSpace({ ...plan(), eavesMode: 'gap' });
    expect(own.takeoff.eaves.mode).toBe('gap');
    await office.put('/api/settings').send({ ...body, eavesMode: 'gap' });
  });
});

describe('hatch kit insulation', () => {
  // U of the hatch lid, BS EN ISO 6946 (no joists, one plain layer), R = Rsi + board + kit + roof space + Rse:
  // bare: 0.10 + 12.5/1000/0.21 + 0.20 + 0.04 = 0.39952 → U 2.5030;
  // 100 mm kit at 0.044 W/mK: 0.39952 + 0.100/0.044 = 2.67225 → U 0.3742.
  const hatchPart = (t: NonNullable<ReturnType<typeof readStoredTakeoff>>) => t.thermal.wholeCeiling.parts.find((p) => p.part === 'hatch')!;

  it('credits the lid with the kit the quote adds, and only while an active hatch kit is in the catalogue', async () => {
    const office = await loginAs(ctx.app, org.office);
    const body = await settingsBody(office);
    expect(body.hatchKitInsulationMm).toBe(0);
    const none = await storedTakeoffOfNewSpace(plan());
    expect(hatchPart(none.takeoff).uAfter).toBeCloseTo(2.503, 3);

    const bad = await office.put('/api/settings').send({ ...body, hatchKitInsulationMm: -5 });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toContain('hatchKitInsulationMm');
    expect((await office.put('/api/settings').send({ ...body, hatchKitInsulationMm: 100 })).status).toBe(200);

    const withKit = await storedTakeoffOfNewSpace(plan());
    expect(withKit.takeoff.settings.hatchInsulationMm).toBe(100);
    expect(hatchPart(withKit.takeoff).uAfter).toBeCloseTo(0.3742, 4);
    expect(hatchPart(withKit.takeoff).basis).toContain('100 mm');
    // The target (U 0.16 on the whole ceiling) is met either way; the lid's credit can only let a cheaper build-up meet it.
    const cost = (t: typeof none.takeoff) => t.layers.reduce((a, l) => a + l.priceMinor, 0);
    expect(withKit.takeoff.thermal.meetsTarget && none.takeoff.thermal.meetsTarget).toBe(true);
    expect(cost(withKit.takeoff)).toBeLessThanOrEqual(cost(none.takeoff));
    const quote = (await office.post(`/api/jobs/${withKit.job.id}/quotes`).send({})).body.quote;
    expect(quote.lines.find((l: { extraKind?: string }) => l.extraKind === 'hatch_kit')?.quantity).toBe(1);

    // No active kit: the quote adds none, so the lid gets no credit either.
    const kits = (await office.get('/api/catalogue/extras')).body.items.filter((e: { kind: string }) => e.kind === 'hatch_kit');
    for (const k of kits) expect((await office.patch(`/api/catalogue/extras/${k.id}`).send({ active: false })).status).toBe(200);
    const noKit = await storedTakeoffOfNewSpace(plan());
    expect(noKit.takeoff.settings.hatchInsulationMm).toBe(0);
    expect(hatchPart(noKit.takeoff).uAfter).toBeCloseTo(2.503, 3);
    const bare = (await office.post(`/api/jobs/${noKit.job.id}/quotes`).send({})).body.quote;
    expect(bare.lines.some((l: { extraKind?: string }) => l.extraKind === 'hatch_kit')).toBe(false);
    for (const k of kits) await office.patch(`/api/catalogue/extras/${k.id}`).send({ active: true });
  });
});
