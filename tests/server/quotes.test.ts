// Quotes API: building a draft from a job's takeoffs, editing, versions, roles and exports.
import fs from 'node:fs';
import path from 'node:path';
import ExcelJS from 'exceljs';
import { PDFParse } from 'pdf-parse';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parseProductCatalogue } from '../../shared/takeoff/products';
import { computeTakeoff } from '../../shared/takeoff/compute-takeoff';
import { PlanRevision } from '../../server/db/models';
import { loadCatalogue } from '../../server/modules/catalogue/catalogue.service';
import { createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { binary, examplePlan, quoteCompany, quoteJob } from './quotes-fixtures';

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await quoteCompany();
});
afterAll(async () => {
  await ctx?.close();
});

describe('building a quote from a job', () => {
  it('builds a draft from the saved plans with an empty body: rolls by roll plan, rule of thumb beside, extras and labour', async () => {
    const { job } = await quoteJob(org);
    const estimator = await loginAs(ctx.app, org.estimator);
    const res = await estimator.post(`/api/jobs/${job.id}/quotes`).send({});
    expect(res.status).toBe(201);
    const q = res.body.quote;
    expect(q.id).toMatch(/^[0-9a-f-]{36}$/);
    expect(q.status).toBe('draft');

    // The roll counts must be the takeoff's own, computed here independently from the same plan and catalogue.
    const { products } = await loadCatalogue(org.id);
    const takeoff = computeTakeoff(examplePlan(), { products: parseProductCatalogue(products), settings: { wasteAllowancePct: 10 } });
    const materials = q.lines.filter((l: { kind: string }) => l.kind === 'material');
    const byProduct = new Map<string, { packing: number; area: number }>();
    for (const l of takeoff.layers) {
      const g = byProduct.get(l.productId) ?? { packing: 0, area: 0 };
      byProduct.set(l.productId, { packing: g.packing + l.rollsByPacking, area: g.area + l.rollsByArea });
    }
    expect(materials.map((l: { productId: string; quantity: number; altQuantity: number }) => [l.productId, l.quantity, l.altQuantity])).toEqual(
      [...byProduct].map(([id, g]) => [id, g.packing, g.area]),
    );

    // The plan has one tank, one hatch and downlights: the matching extras are there.
    const extras = q.lines.filter((l: { kind: string }) => l.kind === 'extra').map((l: { extraKind: string; quantity: number }) => [l.extraKind, l.quantity]);
    const counts = takeoff.exclusions.countsByKind;
    expect(extras).toContainEqual(['tank_jacket', counts.tank]);
    expect(extras).toContainEqual(['hatch_kit', counts.hatch]);
    expect(extras).toContainEqual(['downlight_cover', counts.downlight]);
    expect(extras).toContainEqual(['disposal', 1]);
    expect(q.lines.some((l: { kind: string }) => l.kind === 'labour')).toBe(true);

    // Totals are the integer sums of the lines.
    const net = q.lines.reduce((a: number, l: { netMinor: number }) => a + l.netMinor, 0);
    const tax = q.lines.reduce((a: number, l: { taxMinor: number }) => a + l.taxMinor, 0);
    expect(q.totals.netMinor).toBe(net);
    expect(q.totals.taxMinor).toBe(tax);
    expect(q.totals.grossMinor).toBe(net + tax);
    expect(q.saving.minorPerYear).toBe(Math.round(takeoff.savings.moneyMinorPerYear));
    expect(q.cautions.join(' ')).toMatch(/cold water tank/);
  });

  it('uses the takeoff saved with the plan revision when there is one', async () => {
    const { job, space } = await quoteJob(org);
    const { products } = await loadCatalogue(org.id);
    const saved = computeTakeoff(examplePlan(), { products: parseProductCatalogue(products) });
    // A value only the stored takeoff can carry (the packed count is re-pooled over the job's spaces; the rule of thumb is read as stored).
    saved.layers[0].rollsByArea = 41;
    await PlanRevision.update({ takeoff: saved as never }, { where: { spaceId: space.id } });
    const office = await loginAs(ctx.app, org.office);
    const res = await office.post(`/api/jobs/${job.id}/quotes`).send({});
    expect(res.status).toBe(201);
    const first = res.body.quote.lines.find((l: { productId: string }) => l.productId === saved.layers[0].productId);
    const sameProduct = saved.layers.filter((l) => l.productId === saved.layers[0].productId).reduce((a, l) => a + l.rollsByArea, 0);
    expect(first.altQuantity).toBe(sameProduct);
    expect(sameProduct).toBeGreaterThanOrEqual(41);
  });

  it('prices edited lines to the penny (worked by hand)', async () => {
    const { job } = await quoteJob(org);
    const estimator = await loginAs(ctx.app, org.estimator);
    const created = await estimator.post(`/api/jobs/${job.id}/quotes`).send({});
    // Rates fixed for this company: energy-saving 5%, standard 20%.
    //   12 rolls × 2499 = 29988 at 5% = 1499.4 → 1499
    //   2.345 m × 199 = 466.655 → 467 at 20% = 93.4 → 93
    //   3 covers × 845 = 2535 at 20% = 507
    // net 32990, VAT 5%: 1499 on 29988, VAT 20%: 600 on 3002; total 35089
    const res = await estimator.patch(`/api/quotes/${created.body.quote.id}`).send({
      lines: [
        { kind: 'material', description: 'Wool roll', quantity: 12, unit: 'roll', unitPriceMinor: 2499, unitCostMinor: 1600, taxClass: 'energy_saving' },
        { kind: 'extra', description: 'Pipe lagging', quantity: 2.345, unit: 'm', unitPriceMinor: 199, taxClass: 'standard' },
        { kind: 'extra', description: 'Downlight cover', quantity: 3, unit: 'each', unitPriceMinor: 845, unitCostMinor: 400, taxClass: 'standard' },
      ],
    });
    expect(res.status).toBe(200);
    const q = res.body.quote;
    expect(q.version).toBe(1);
    expect(q.lines.map((l: { netMinor: number }) => l.netMinor)).toEqual([29988, 467, 2535]);
    expect(q.totals).toMatchObject({
      netMinor: 32990,
      taxByRate: [
        { rateBp: 2000, netMinor: 3002, taxMinor: 600 },
        { rateBp: 500, netMinor: 29988, taxMinor: 1499 },
      ],
      taxMinor: 2099,
      grossMinor: 35089,
      costMinor: 12 * 1600 + 3 * 400,
      marginMinor: 32990 - 20400,
    });
  });

  it('refuses a line with a fractional price or four decimals, naming the field', async () => {
    const { job } = await quoteJob(org);
    const office = await loginAs(ctx.app, org.office);
    const created = await office.post(`/api/jobs/${job.id}/quotes`).send({});
    const res = await office.patch(`/api/quotes/${created.body.quote.id}`).send({
      lines: [{ description: 'x', quantity: 1.0001, unitPriceMinor: 10.5, taxClass: 'standard' }],
    });
    expect(res.status).toBe(422);
    const paths = res.body.error.details.map((d: { path: string }) => d.path);
    expect(paths).toEqual(expect.arrayContaining(['lines.0.quantity', 'lines.0.unitPriceMinor']));
  });
});

describe('roles and companies', () => {
  it('keeps installers out (403) and another company out (404)', async () => {
    const { job } = await quoteJob(org);
    const office = await loginAs(ctx.app, org.office);
    const q = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
    const installer = await loginAs(ctx.app, org.installer);
    expect((await installer.post(`/api/jobs/${job.id}/quotes`).send({})).status).toBe(403);
    expect((await installer.get(`/api/quotes/${q.id}`)).status).toBe(403);
    expect((await installer.get(`/api/quotes/${q.id}/pdf`)).status).toBe(403);
    expect((await installer.get('/api/catalogue/products')).status).toBe(403);
    expect((await installer.get('/api/settings')).status).toBe(403);

    const other = await createOrgWithUsers();
    const stranger = await loginAs(ctx.app, other.office);
    expect((await stranger.get(`/api/quotes/${q.id}`)).status).toBe(404);
    expect((await stranger.post(`/api/jobs/${job.id}/quotes`).send({})).status).toBe(404);
    expect((await stranger.get(`/api/quotes/${q.id}/xlsx`)).status).toBe(404);
    expect((await request(ctx.app).get(`/api/quotes/${q.id}`)).status).toBe(401);
  });

  it('lets estimators draft but not send', async () => {
    const { job } = await quoteJob(org);
    const estimator = await loginAs(ctx.app, org.estimator);
    const q = (await estimator.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
    const res = await estimator.post(`/api/quotes/${q.id}/send`).send({});
    expect(res.status).toBe(403);
    expect(ctx.outbox.messages().filter((m) => m.to.includes('winifred'))).toHaveLength(0);
  });
});

describe('exports', () => {
  it('gives a PDF whose text has the customer, the totals and the cautions', async () => {
    const { job } = await quoteJob(org, { customerName: 'Oswin Treharne' });
    const office = await loginAs(ctx.app, org.office);
    const q = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
    const res = await office.get(`/api/quotes/${q.id}/pdf`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toMatch(/application\/pdf/);
    // Kept for a person to look at (pdftoppm -png test-output/pdf/quote.pdf).
    fs.mkdirSync(path.join(process.cwd(), 'test-output', 'pdf'), { recursive: true });
    fs.writeFileSync(path.join(process.cwd(), 'test-output', 'pdf', 'quote.pdf'), res.body);
    const text = (await new PDFParse({ data: new Uint8Array(res.body) }).getText()).text;
    const money = (m: number) => new Intl.NumberFormat('en-GB', { style: 'currency', currency: 'GBP' }).format(m / 100);
    expect(text).toContain('Oswin Treharne');
    expect(text).toContain(q.number);
    expect(text).toContain(money(q.totals.grossMinor));
    expect(text).toContain(money(q.totals.netMinor));
    expect(text).toMatch(/cold\s+water\s+tank/);
    expect(text).toMatch(/work\s+at\s+height/);
  });

  it('embeds the company logo in the PDF once one is uploaded', async () => {
    const { job } = await quoteJob(org);
    const office = await loginAs(ctx.app, org.office);
    const q = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
    const before = await office.get(`/api/quotes/${q.id}/pdf`).buffer(true).parse(binary);
    expect(before.body.includes('/Subtype /Image')).toBe(false);
    // The smallest valid PNG, 1×1 pixel (signature, IHDR, IDAT, IEND), written out byte by byte.
    const png = Buffer.from(
      '89504e470d0a1a0a0000000d4948445200000001000000010802000000907753de0000000c4944415478da63f8ffff3f0005fe02fea7359a3b0000000049454e44ae426082',
      'hex',
    );
    expect((await office.post('/api/settings/logo').attach('logo', png, { filename: 'logo.png', contentType: 'image/png' })).status).toBe(200);
    const after = await office.get(`/api/quotes/${q.id}/pdf`).buffer(true).parse(binary);
    expect(after.body.includes('/Subtype /Image')).toBe(true);
    await office.delete('/api/settings/logo');
  });

  it('gives an XLSX whose numbers equal the API', async () => {
    const { job } = await quoteJob(org);
    const office = await loginAs(ctx.app, org.office);
    const q = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
    const res = await office.get(`/api/quotes/${q.id}/xlsx`).buffer(true).parse(binary);
    expect(res.status).toBe(200);
    const wb = new ExcelJS.Workbook();
    await wb.xlsx.load(res.body as unknown as ArrayBuffer);
    const ws = wb.getWorksheet('Quote')!;
    const rows: unknown[][] = [];
    ws.eachRow((row) => rows.push((row.values as unknown[]).slice(1)));
    const lineRows = rows.filter((r) => typeof r[0] === 'number');
    expect(lineRows).toHaveLength(q.lines.length);
    lineRows.forEach((r, i) => {
      const l = q.lines[i];
      expect(r[3]).toBe(l.quantity);
      expect(Math.round((r[5] as number) * 100)).toBe(l.unitPriceMinor);
      expect(Math.round((r[6] as number) * 100)).toBe(l.netMinor);
      expect(Math.round((r[8] as number) * 100)).toBe(l.taxMinor);
    });
    const total = rows.find((r) => r[1] === 'total')!;
    expect(Math.round((total[6] as number) * 100)).toBe(q.totals.netMinor);
    expect(Math.round((total[8] as number) * 100)).toBe(q.totals.taxMinor);
    expect(Math.round((total[9] as number) * 100)).toBe(q.totals.grossMinor);
    expect(wb.getWorksheet('Takeoff')!.rowCount).toBeGreaterThan(1);
  });

  it('gives a CSV with every line, the totals and the takeoff', async () => {
    const { job } = await quoteJob(org);
    const office = await loginAs(ctx.app, org.office);
    const q = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
    const res = await office.get(`/api/quotes/${q.id}/csv`);
    expect(res.status).toBe(200);
    const rows = res.text
      .replace(/^\uFEFF/, '')
      .trim()
      .split('\r\n');
    expect(rows.filter((r) => r.startsWith('line,'))).toHaveLength(q.lines.length);
    const total = rows.find((r) => r.includes(',Total,'))!;
    expect(total).toContain((q.totals.grossMinor / 100).toFixed(2));
    expect(rows.some((r) => r.startsWith('takeoff,'))).toBe(true);
  });
});
