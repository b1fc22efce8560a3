// Company settings and catalogue API: office edits, estimators read, installers and other companies kept out.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pngImage } from '../helpers/images';
import { createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { binary } from './quotes-fixtures';
import { takeoffSettingsOf } from '../../server/modules/plan-revisions/plan-takeoff';

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers();
});
afterAll(async () => {
  await ctx?.close();
});

describe('company settings', () => {
  it('starts a new company with defaults and the UK dated tax rates (VAT Notice 708/6)', async () => {
    const office = await loginAs(ctx.app, org.office);
    const res = await office.get('/api/settings');
    expect(res.status).toBe(200);
    expect(res.body.settings).toMatchObject({ currency: 'GBP', validityDays: 30, degreeDays: 2462, hasLogo: false });
    const rates = (await office.get('/api/catalogue/tax-rates')).body.items;
    expect(
      rates.filter((r: { taxClass: string }) => r.taxClass === 'energy_saving').map((r: { rateBp: number; validFrom: string }) => [r.validFrom, r.rateBp]),
    ).toEqual(
      expect.arrayContaining([
        ['2023-05-01', 0],
        ['2027-04-01', 500],
      ]),
    );
  });

  it("creates a new company's settings once even when many first requests arrive together", async () => {
    const fresh = await createOrgWithUsers();
    const office = await loginAs(ctx.app, fresh.office);
    const results = await Promise.all(Array.from({ length: 8 }, (_, i) => office.get(i % 2 ? '/api/settings' : '/api/catalogue/tax-rates')));
    expect(results.map((r) => r.status)).toEqual(Array(8).fill(200));
    expect((await office.get('/api/catalogue/tax-rates')).body.items).toHaveLength(4);
  });

  it("saves the office's changes and names the field it refuses", async () => {
    const office = await loginAs(ctx.app, org.office);
    const current = (await office.get('/api/settings')).body.settings;
    const { hasLogo: _ignored, ...body } = current;
    const ok = await office.put('/api/settings').send({ ...body, companyName: 'Rafter & Wool Ltd', validityDays: 45, labour: { ...body.labour, crewSize: 3 } });
    expect(ok.status).toBe(200);
    expect(ok.body.settings).toMatchObject({ companyName: 'Rafter & Wool Ltd', validityDays: 45, labour: { crewSize: 3 } });
    const bad = await office.put('/api/settings').send({ ...body, currency: 'pounds', labour: { ...body.labour, hourlyRateMinor: 12.5 } });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toEqual(expect.arrayContaining(['currency', 'labour.hourlyRateMinor']));
  });

  it('keeps the minimum usable offcut length (500 mm to start with) and hands it to the takeoff', async () => {
    const office = await loginAs(ctx.app, org.office);
    const { hasLogo: _ignored, ...body } = (await office.get('/api/settings')).body.settings;
    expect(body.minOffcutMm).toBe(500);
    const ok = await office.put('/api/settings').send({ ...body, minOffcutMm: 800 });
    expect(ok.status).toBe(200);
    expect(ok.body.settings.minOffcutMm).toBe(800);
    expect(takeoffSettingsOf(ok.body.settings).minOffcutMm).toBe(800);
    const bad = await office.put('/api/settings').send({ ...body, minOffcutMm: 20 });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toContain('minOffcutMm');
  });

  it('stores what installers must record on finishing, keeps it through a save of something else, and names a part it does not know', async () => {
    const own = await createOrgWithUsers();
    const office = await loginAs(ctx.app, own.office);
    const { hasLogo: _ignored, ...body } = (await office.get('/api/settings')).body.settings;
    expect(body.actualsRequired).toEqual([]);
    const set = await office.put('/api/settings').send({ ...body, actualsRequired: ['rolls', 'hours'] });
    expect(set.body.settings.actualsRequired).toEqual(['rolls', 'hours']);
    // What the settings page sends for an unrelated change: the stored body with one field changed.
    const { hasLogo: _h, ...stored } = (await office.get('/api/settings')).body.settings;
    expect((await office.put('/api/settings').send({ ...stored, phone: '01632 960555' })).status).toBe(200);
    expect((await office.get('/api/settings')).body.settings).toMatchObject({ phone: '01632 960555', actualsRequired: ['rolls', 'hours'] });
    const bad = await office.put('/api/settings').send({ ...stored, actualsRequired: ['rolls', 'snacks'] });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details.map((d: { path: string }) => d.path)).toContain('actualsRequired.1');
    expect((await office.get('/api/settings')).body.settings.actualsRequired).toEqual(['rolls', 'hours']);
  });

  it('lets estimators read but not change settings, and keeps installers out', async () => {
    const estimator = await loginAs(ctx.app, org.estimator);
    expect((await estimator.get('/api/settings')).status).toBe(200);
    expect((await estimator.put('/api/settings').send({})).status).toBe(403);
    expect((await estimator.post('/api/catalogue/products').send({})).status).toBe(403);
    const installer = await loginAs(ctx.app, org.installer);
    expect((await installer.get('/api/settings')).status).toBe(403);
    expect((await installer.get('/api/catalogue/extras')).status).toBe(403);
  });

  it('takes a PNG logo, refuses a file that is not an image, and serves the logo back', async () => {
    const office = await loginAs(ctx.app, org.office);
    const refused = await office.post('/api/settings/logo').attach('logo', Buffer.from('not an image'), { filename: 'logo.png', contentType: 'image/png' });
    expect(refused.status).toBe(400);
    expect(refused.body.error.code).toBe('unsupported_type');
    const png = await pngImage(1, 1);
    const ok = await office.post('/api/settings/logo').attach('logo', png, { filename: 'logo.png', contentType: 'image/png' });
    expect(ok.status).toBe(200);
    expect(ok.body.settings.hasLogo).toBe(true);
    const back = await office.get('/api/settings/logo').buffer(true).parse(binary);
    expect(back.headers['content-type']).toMatch(/image\/png/);
    expect(Buffer.compare(back.body, png)).toBe(0);
  });
});

describe('catalogue', () => {
  const product = {
    name: 'Test roll 100 mm',
    thicknessMm: 100,
    rollWidthMm: 1200,
    lanes: 2,
    rollLengthMm: 7000,
    coverageM2: 8.4,
    lambdaWmK: 0.04,
    unitPriceMinor: 2299,
  };

  it('creates, edits and deletes a product, scoped to the company', async () => {
    const office = await loginAs(ctx.app, org.office);
    const created = await office.post('/api/catalogue/products').send(product);
    expect(created.status).toBe(201);
    expect(created.body.product).toMatchObject({ ...product, active: true, taxClass: 'energy_saving', roles: ['base', 'cross'] });
    const id = created.body.product.id;
    const edited = await office.patch(`/api/catalogue/products/${id}`).send({ unitPriceMinor: 2399, active: false });
    expect(edited.body.product).toMatchObject({ unitPriceMinor: 2399, active: false });

    const other = await createOrgWithUsers();
    const stranger = await loginAs(ctx.app, other.office);
    expect((await stranger.patch(`/api/catalogue/products/${id}`).send({ unitPriceMinor: 1 })).status).toBe(404);
    expect((await stranger.get('/api/catalogue/products')).body.items).toEqual([]);

    expect((await office.delete(`/api/catalogue/products/${id}`)).status).toBe(204);
    expect((await office.get('/api/catalogue/products')).body.items.find((p: { id: string }) => p.id === id)).toBeUndefined();
  });

  it('refuses a price in pounds with decimals and a conductivity no roll has', async () => {
    const office = await loginAs(ctx.app, org.office);
    const res = await office.post('/api/catalogue/products').send({ ...product, unitPriceMinor: 22.99, lambdaWmK: 0.001 });
    expect(res.status).toBe(422);
    expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual(expect.arrayContaining(['unitPriceMinor', 'lambdaWmK']));
  });

  it('refuses a second tax rate for the same class and start date', async () => {
    const office = await loginAs(ctx.app, org.office);
    const body = { taxClass: 'standard', rateBp: 1750, validFrom: '2030-01-01' };
    expect((await office.post('/api/catalogue/tax-rates').send(body)).status).toBe(201);
    const again = await office.post('/api/catalogue/tax-rates').send(body);
    expect(again.status).toBe(409);
  });
});
