import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PlanRevision } from '../../server/db/models';
import { Product } from '../../server/db/models/product';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

const examples = path.join(__dirname, '..', '..', 'examples');
const lShape = (): Plan => planSchema.parse(JSON.parse(fs.readFileSync(path.join(examples, 'l-shape.json'), 'utf8')));
const rect = (): Plan => planSchema.parse(JSON.parse(fs.readFileSync(path.join(examples, 'rectangle.json'), 'utf8')));

let ctx: TestContext;
let org: TestOrg;
let other: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  other = await createOrgWithUsers(ctx);
});
afterAll(async () => ctx.close());

describe('GET /api/spaces/:id/plan', () => {
  it('returns a starter plan at revision 0 when nothing was saved, with the company takeoff inputs (no fallback catalogue)', async () => {
    const { space } = await createJob(org, { spaceName: 'Garage loft' });
    const agent = await loginAs(ctx.app, org.estimator);
    const res = await agent.get(`/api/spaces/${space.id}/plan`);
    expect(res.status).toBe(200);
    expect(res.body.revision).toBe(0);
    expect(res.body.plan).toMatchObject({ format: 'quiltline-plan/1', name: 'Garage loft', outline: [] });
    expect([res.body.takeoff, res.body.takeoffStored]).toEqual([null, false]);
    // This company has no products yet: the inputs say so instead of borrowing examples/products.json.
    expect(res.body.takeoffInputs.products).toEqual([]);
    expect(res.body.takeoffInputs.settings).toMatchObject({ wasteAllowancePct: 10 });
    expect(res.body.canWrite).toBe(true);
  });

  it('returns the newest revision', async () => {
    const { space } = await createJob(org, { plan: lShape() });
    const agent = await loginAs(ctx.app, org.office);
    const res = await agent.get(`/api/spaces/${space.id}/plan`);
    expect(res.body.revision).toBe(1);
    expect(res.body.plan).toEqual(lShape());
  });

  it('is a 404 for another company, and for an installer not assigned to the job', async () => {
    const { space } = await createJob(org, { plan: lShape() });
    const outsider = await loginAs(ctx.app, other.office);
    expect((await outsider.get(`/api/spaces/${space.id}/plan`)).status).toBe(404);
    const installer = await loginAs(ctx.app, org.installer);
    expect((await installer.get(`/api/spaces/${space.id}/plan`)).status).toBe(404);
  });

  it('lets the assigned installer read the plan without prices, but not write it', async () => {
    const { space } = await createJob(org, { plan: lShape(), assignedInstallerId: org.installer.id });
    const installer = await loginAs(ctx.app, org.installer);
    const res = await installer.get(`/api/spaces/${space.id}/plan`);
    expect(res.status).toBe(200);
    expect(res.body.canWrite).toBe(false);
    expect(res.body.takeoffInputs.products.every((p: { priceMinor: number }) => p.priceMinor === 0)).toBe(true);
    const put = await installer.put(`/api/spaces/${space.id}/plan`).send({ plan: rect(), baseRevision: 1 });
    expect(put.status).toBe(403);
    expect(await PlanRevision.count({ where: { spaceId: space.id } })).toBe(1);
  });
  it('shows the installer the layers the office priced, although the installer gets no prices', async () => {
    // Arrange: two cross rolls alike but for price; by name the dearer sorts first, so a
    // catalogue without prices would tie on cost and take it.
    const roll = {
      supplierCode: '',
      thicknessMm: 170,
      rollWidthMm: 1140,
      lanes: 1,
      rollLengthMm: 5000,
      coverageM2: 5.7,
      lambdaWmK: 0.044,
      unitCostMinor: 1000,
      taxClass: 'energy_saving' as const,
      roles: ['cross' as const],
      active: true,
    };
    const priced = await createOrgWithUsers(ctx);
    await Product.create({ ...roll, organisationId: priced.id, name: 'A dear 170 mm roll', unitPriceMinor: 4000 });
    const cheap = await Product.create({ ...roll, organisationId: priced.id, name: 'B cheap 170 mm roll', unitPriceMinor: 2000 });
    const plan: Plan = { ...rect(), existing: { depthMm: 100, condition: 'good' }, target: { depthMm: 270 }, products: undefined };
    const { space } = await createJob(priced, { assignedInstallerId: priced.installer.id });
    const estimator = await loginAs(ctx.app, priced.estimator);
    expect((await estimator.put(`/api/spaces/${space.id}/plan`).send({ plan, baseRevision: 0 })).status).toBe(201);
    // Act
    const res = await (await loginAs(ctx.app, priced.installer)).get(`/api/spaces/${space.id}/plan`);
    // Assert: the installer is shown the stored artefact with the office's choice; the plan is not patched.
    expect(res.body.plan.products).toBeUndefined();
    expect(res.body.takeoff.productChoice).toEqual({ source: 'catalogue', baseProductId: null, crossProductIds: [cheap.id] });
    expect(res.body.takeoff.layers.filter((l: { role: string }) => l.role === 'cross').map((l: { productId: string }) => l.productId)).toEqual([cheap.id]);
    // …and no price on the way.
    expect(res.body.takeoff.layers.every((l: { priceMinor: number }) => l.priceMinor === 0)).toBe(true);
    expect(res.body.takeoff.savings.moneyMinorPerYear).toBe(0);
    // Writers compute it live from the same inputs and are told it is stored.
    const office = (await (await loginAs(ctx.app, priced.office)).get(`/api/spaces/${space.id}/plan`)).body;
    expect([office.takeoff, office.takeoffStored]).toEqual([null, true]);
  });
});

describe('PUT /api/spaces/:id/plan', () => {
  it('saves the next revision with the takeoff recomputed by the engine', async () => {
    const { space } = await createJob(org, { plan: lShape() });
    const agent = await loginAs(ctx.app, org.estimator);
    const res = await agent.put(`/api/spaces/${space.id}/plan`).send({ plan: rect(), baseRevision: 1 });
    expect(res.status).toBe(201);
    expect(res.body.revision).toBe(2);
    const row = await PlanRevision.findOne({ where: { spaceId: space.id, revision: 2 } });
    const inputs = (await agent.get(`/api/spaces/${space.id}/plan`)).body.takeoffInputs;
    const expected = computeTakeoff(rect(), { products: parseProductCatalogue(inputs.products), settings: inputs.settings });
    expect((row!.takeoff as { netAreaM2: number }).netAreaM2).toBe(expected.netAreaM2);
    expect(row!.authorId).toBe(org.estimator.id);
    // The older revision is kept untouched.
    const first = await PlanRevision.findOne({ where: { spaceId: space.id, revision: 1 } });
    expect(first!.plan).toEqual(lShape());
  });

  it('answers 409 when the base revision is stale, and writes nothing', async () => {
    const { space } = await createJob(org, { plan: lShape() });
    const a = await loginAs(ctx.app, org.estimator);
    const b = await loginAs(ctx.app, org.office);
    expect((await a.put(`/api/spaces/${space.id}/plan`).send({ plan: rect(), baseRevision: 1 })).status).toBe(201);
    const stale = await b.put(`/api/spaces/${space.id}/plan`).send({ plan: { ...lShape(), name: 'Theirs' }, baseRevision: 1 });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('revision_conflict');
    expect(await PlanRevision.count({ where: { spaceId: space.id } })).toBe(2);
  });

  it.each([
    [
      'a self-crossing outline',
      {
        outline: [
          [0, 0],
          [4000, 3000],
          [4000, 0],
          [0, 3000],
        ],
      },
      /cross/i,
    ],
    [
      'two corners',
      {
        outline: [
          [0, 0],
          [4000, 0],
        ],
      },
      /3|three/i,
    ],
    ['an unknown format', { format: 'other-plan/9' }, /unknown plan format/],
  ])('refuses %s with 422 and the engine messages, writing nothing', async (_name, patch, msg) => {
    const { space } = await createJob(org, { plan: lShape() });
    const agent = await loginAs(ctx.app, org.estimator);
    const res = await agent.put(`/api/spaces/${space.id}/plan`).send({ plan: { ...lShape(), ...patch }, baseRevision: 1 });
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(msg);
    expect(res.body.error.details.length).toBeGreaterThan(0);
    expect(await PlanRevision.count({ where: { spaceId: space.id } })).toBe(1);
  });

  it('is a 404 for another company and writes nothing', async () => {
    const { space } = await createJob(org, { plan: lShape() });
    const outsider = await loginAs(ctx.app, other.estimator);
    const res = await outsider.put(`/api/spaces/${space.id}/plan`).send({ plan: rect(), baseRevision: 1 });
    expect(res.status).toBe(404);
    expect(await PlanRevision.count({ where: { spaceId: space.id } })).toBe(1);
  });
});

describe('revisions', () => {
  it('lists revisions newest first with author and time, and restores an old one as a new revision', async () => {
    const { space } = await createJob(org, { plan: lShape() });
    const agent = await loginAs(ctx.app, org.estimator);
    await agent.put(`/api/spaces/${space.id}/plan`).send({ plan: rect(), baseRevision: 1, note: 'rectangle' });
    const list = await agent.get(`/api/spaces/${space.id}/revisions`);
    expect(list.status).toBe(200);
    expect(list.body.items.map((r: { revision: number }) => r.revision)).toEqual([2, 1]);
    expect(list.body.items[0].author.name).toBe(org.estimator.name);
    expect(list.body.items[0].note).toBe('rectangle');
    expect(Date.parse(list.body.items[0].createdAt)).not.toBeNaN();

    const restored = await agent.post(`/api/spaces/${space.id}/revisions/1/restore`).send({ baseRevision: 2 });
    expect(restored.status).toBe(201);
    expect(restored.body.revision).toBe(3);
    const now = await agent.get(`/api/spaces/${space.id}/plan`);
    expect(now.body.plan).toEqual(lShape());
    // The restored revision carries the takeoff of the plan it restores, like any other save.
    expect(now.body.takeoffStored).toBe(true);
    const row3 = (await PlanRevision.findOne({ where: { spaceId: space.id, revision: 3 } }))!.takeoff as { planName: string; netAreaM2: number };
    expect([row3.planName, row3.netAreaM2]).toEqual([lShape().name, computeTakeoff(lShape(), { products: [] }).netAreaM2]);
    expect(await PlanRevision.count({ where: { spaceId: space.id } })).toBe(3);

    const stale = await agent.post(`/api/spaces/${space.id}/revisions/2/restore`).send({ baseRevision: 2 });
    expect(stale.status).toBe(409);
    expect((await agent.get(`/api/spaces/${space.id}/revisions/9`)).status).toBe(404);
  });
});

describe('POST /api/spaces/:id/background', () => {
  // The smallest valid PNG: 1×1 transparent pixel.
  const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==', 'base64');

  it('stores an image and serves it back to the same company only', async () => {
    const { space } = await createJob(org, { plan: lShape() });
    const agent = await loginAs(ctx.app, org.estimator);
    const res = await agent.post(`/api/spaces/${space.id}/background`).attach('image', png, 'drawing.png');
    expect(res.status).toBe(201);
    expect(res.body.url).toMatch(new RegExp(`^/api/spaces/${space.id}/background/[0-9a-f-]{36}\\.png$`));
    const img = await agent.get(res.body.url);
    expect(img.status).toBe(200);
    expect(img.headers['content-type']).toBe('image/png');
    expect(Buffer.compare(img.body as Buffer, png)).toBe(0);
    const outsider = await loginAs(ctx.app, other.office);
    expect((await outsider.get(res.body.url)).status).toBe(404);
  });

  it('refuses files that are not images, and images over the size limit, with clear messages', async () => {
    const { space } = await createJob(org, { plan: lShape() });
    const agent = await loginAs(ctx.app, org.estimator);
    const text = await agent.post(`/api/spaces/${space.id}/background`).attach('image', Buffer.from('not a picture'), 'notes.png');
    expect(text.status).toBe(415);
    expect(text.body.error.message).toMatch(/PNG, JPEG, WebP or GIF/);
    const big = Buffer.concat([png, Buffer.alloc(9 * 1024 * 1024)]);
    const tooBig = await agent.post(`/api/spaces/${space.id}/background`).attach('image', big, 'huge.png');
    expect(tooBig.status).toBe(413);
    expect(tooBig.body.error.message).toMatch(/larger than 8 MB/);
    const none = await agent.post(`/api/spaces/${space.id}/background`).field('x', '1');
    expect(none.status).toBe(422);
  });
});
