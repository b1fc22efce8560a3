import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PlanRevision } from '../../server/db/models';
import { CompanySetting } from '../../server/db/models/company-setting';
import { companyTakeoffInputs } from '../../server/modules/plan-revisions/plan-takeoff';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

/*
 * The editor's plan read takes the company's takeoff inputs from the same query as the plan, while
 * a save reads them through companyTakeoffInputs: both must agree (the editor's live takeoff equals
 * the stored one), and a change made through one app instance shows on the other's next read.
 */

const examples = path.join(__dirname, '..', '..', 'examples');
const lShape = (): Plan => planSchema.parse(JSON.parse(fs.readFileSync(path.join(examples, 'l-shape.json'), 'utf8')));

const roll = {
  thicknessMm: 170,
  rollWidthMm: 1140,
  lanes: 3,
  rollLengthMm: 5000,
  coverageM2: 5.7,
  lambdaWmK: 0.044,
  roles: ['base', 'cross'],
};

let a: TestContext;
let b: TestContext;
let org: TestOrg;

beforeAll(async () => {
  a = await createTestContext();
  b = await createTestContext();
  org = await createOrgWithUsers(a);
});
afterAll(async () => {
  await a?.close();
  await b?.close();
});

type Inputs = Awaited<ReturnType<typeof companyTakeoffInputs>>;
const zeroPrices = (i: Inputs): Inputs => ({
  products: i.products.map((p) => ({ ...p, priceMinor: 0 })),
  settings: { ...i.settings, fuelPriceMinorPerKwh: 0 },
});

describe('the takeoff inputs sent with GET /api/spaces/:id/plan', () => {
  it('equal the save path’s, and follow settings, catalogue and hatch kit changes made through another instance', async () => {
    // Arrange: a plan on a job assigned to the installer; the office edits through instance A.
    const { space } = await createJob(org, { plan: lShape(), assignedInstallerId: org.installer.id });
    const officeA = await loginAs(a.app, org.office);
    const officeB = await loginAs(b.app, org.office);
    const installerB = await loginAs(b.app, org.installer);
    const readB = async () => (await officeB.get(`/api/spaces/${space.id}/plan`).expect(200)).body.takeoffInputs as Inputs;

    const product = (name: string, unitPriceMinor: number) =>
      officeA
        .post('/api/catalogue/products')
        .send({ ...roll, name, unitPriceMinor })
        .expect(201);
    const dear = (await product('B roll 170 mm', 3100)).body.product;
    await product('A roll 170 mm', 2900);
    const retired = (await product('C roll 170 mm', 2500)).body.product;
    await officeA.patch(`/api/catalogue/products/${retired.id}`).send({ active: false }).expect(200);
    const kit = (await officeA.post('/api/catalogue/extras').send({ kind: 'hatch_kit', name: 'Hatch kit', unitPriceMinor: 4500 }).expect(201)).body.extra;
    const { settings } = (await officeA.get('/api/settings').expect(200)).body;
    const put = (changes: object) =>
      officeA
        .put('/api/settings')
        .send({ ...settings, ...changes })
        .expect(200);
    await put({ wasteAllowance: 0.15, minOffcutMm: 300, eavesMode: 'ventilators', hatchKitInsulationMm: 100, fuelPriceMinorPerKwh: 7.25 });

    // Act + assert: B's next read shows all of it, exactly as a save would read it.
    let inputs = await readB();
    expect(inputs).toEqual(await companyTakeoffInputs(org.id));
    expect(inputs.products.map((p) => [p.name, p.priceMinor, p.lanesPerRoll])).toEqual([
      ['A roll 170 mm', 2900, 3],
      ['B roll 170 mm', 3100, 3],
    ]);
    expect(inputs.settings).toMatchObject({ minOffcutMm: 300, eavesMode: 'ventilators', hatchInsulationMm: 100, fuelPriceMinorPerKwh: 7.25 });
    expect(inputs.settings.wasteAllowancePct).toBeCloseTo(15, 9);
    // The installer gets the same inputs with every price zeroed.
    const installerRead = (await installerB.get(`/api/spaces/${space.id}/plan`).expect(200)).body;
    expect(installerRead.takeoffInputs).toEqual(zeroPrices(await companyTakeoffInputs(org.id)));

    // A second round of changes through A: a price, the kit withdrawn (no hatch credit), less waste.
    await officeA.patch(`/api/catalogue/products/${dear.id}`).send({ unitPriceMinor: 2700 }).expect(200);
    await officeA.patch(`/api/catalogue/extras/${kit.id}`).send({ active: false }).expect(200);
    await put({ wasteAllowance: 0.05 });
    inputs = await readB();
    expect(inputs).toEqual(await companyTakeoffInputs(org.id));
    expect(inputs.products.find((p) => p.name === 'B roll 170 mm')!.priceMinor).toBe(2700);
    expect(inputs.settings.hatchInsulationMm).toBe(0);
    expect(inputs.settings.wasteAllowancePct).toBeCloseTo(5, 9);
  });

  it('are the defaults for a company that never saved its settings, as a save reads them', async () => {
    const fresh = await createOrgWithUsers(b);
    await CompanySetting.destroy({ where: { organisationId: fresh.id } });
    const { space } = await createJob(fresh, { plan: lShape() });
    const res = await (await loginAs(b.app, fresh.estimator)).get(`/api/spaces/${space.id}/plan`).expect(200);
    expect(res.body.takeoffInputs).toEqual(await companyTakeoffInputs(fresh.id));
    expect(res.body.takeoffInputs.settings).toMatchObject({ wasteAllowancePct: 10, minOffcutMm: 500 });
  });
});

describe('whether the plan read reports a stored takeoff', () => {
  it('says stored for the current format only, to writers and viewers alike', async () => {
    const { space } = await createJob(org, { plan: lShape(), assignedInstallerId: org.installer.id });
    const office = await loginAs(b.app, org.office);
    const installer = await loginAs(b.app, org.installer);
    const read = async (agent: typeof office) => (await agent.get(`/api/spaces/${space.id}/plan`).expect(200)).body;
    expect((await read(office)).takeoffStored).toBe(true);
    expect((await read(installer)).takeoff.format).toBe('quiltline-takeoff/4');

    // An artefact of an older format (before the start-up backfill recomputes it).
    const row = (await PlanRevision.findOne({ where: { spaceId: space.id } }))!;
    await PlanRevision.update({ takeoff: { ...(row.takeoff as object), format: 'quiltline-takeoff/1' } as never }, { where: { id: row.id } });
    expect((await read(office)).takeoffStored).toBe(false);
    expect(await read(installer)).toMatchObject({ takeoffStored: false, takeoff: null });

    // Writers' answer comes from the stored format column (migration 0508), which PostgreSQL keeps in
    // step with every write of the takeoff: back to the current format, then none at all.
    await PlanRevision.update({ takeoff: row.takeoff as never }, { where: { id: row.id } });
    expect((await read(office)).takeoffStored).toBe(true);
    await PlanRevision.update({ takeoff: null as never }, { where: { id: row.id } });
    expect((await read(office)).takeoffStored).toBe(false);
  });
});
