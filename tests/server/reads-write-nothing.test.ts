// A GET writes nothing: company settings are read with their defaults until the office saves them,
// and a sent quote past its valid-until date reads as expired without the stored status changing.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CompanySetting, InstallSetting, Organisation, Quote, TaxRate } from '../../server/db/models';
import { createTestContext, createUser, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { quoteCompany, quoteJob } from './quotes-fixtures';

let ctx: TestContext;

beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => {
  await ctx?.close();
});

/** Row counts of every table a read used to write. */
async function counts(organisationId: string) {
  return {
    settings: await CompanySetting.count({ where: { organisationId } }),
    taxRates: await TaxRate.count({ where: { organisationId } }),
    install: await InstallSetting.count({ where: { organisationId } }),
  };
}

describe('reads write nothing', () => {
  it("answers a company without a settings row with the defaults, and saves them only on the office's first change", async () => {
    // A company made without its defaults (as one made before they were created with the company).
    const org = await Organisation.create({ name: 'Bare Lofts' });
    const office = await loginAs(ctx.app, await createUser(org.id, 'office'));
    for (const url of [
      '/api/settings',
      '/api/catalogue/tax-rates',
      '/api/catalogue/products',
      '/api/payments/settings',
      '/api/schedule/settings',
      '/api/schedule',
    ]) {
      expect((await office.get(url)).status, url).toBe(200);
    }
    const settings = (await office.get('/api/settings')).body.settings;
    expect(settings).toMatchObject({ companyName: 'Bare Lofts', currency: 'GBP', validityDays: 30 });
    expect(await counts(org.id)).toEqual({ settings: 0, taxRates: 0, install: 0 });

    const saved = await office.put('/api/settings').send({ ...settings, validityDays: 45 });
    expect(saved.status).toBe(200);
    expect(saved.body.settings.validityDays).toBe(45);
    expect(await counts(org.id)).toEqual({ settings: 1, taxRates: 4, install: 0 });
    expect((await office.patch('/api/schedule/settings').send({ maxJobsPerDay: 2 })).body.settings.maxJobsPerDay).toBe(2);
    expect((await counts(org.id)).install).toBe(1);
  });

  it('shows a sent quote past its valid-until date as expired to the office and the customer, and stores nothing', async () => {
    const org: TestOrg = await quoteCompany();
    const { job } = await quoteJob(org, { email: 'perpetua.late@example.com' });
    const office = await loginAs(ctx.app, org.office);
    const draft = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
    expect((await office.post(`/api/quotes/${draft.id}/send`).send({})).status).toBe(200);
    const mail = await ctx.outbox.waitFor((m) => m.to.includes('perpetua.late@example.com'));
    const token = decodeURIComponent(new URL(mail.links.find((l) => new URL(l).pathname.startsWith('/q/'))!).pathname.slice(3));
    await Quote.update({ validUntil: '2020-01-01' }, { where: { id: draft.id } });
    const before = (await Quote.findByPk(draft.id))!.updatedAt.getTime();

    expect((await office.get(`/api/quotes/${draft.id}`)).body.quote.status).toBe('expired');
    const listed = (await office.get(`/api/jobs/${job.id}/quotes`)).body.quotes.find((q: { id: string }) => q.id === draft.id);
    expect(listed.status).toBe('expired');
    expect((await request(ctx.app).get(`/api/public/quotes/${encodeURIComponent(token)}`)).status).toBe(410);

    const row = (await Quote.findByPk(draft.id))!;
    expect(row.status).toBe('sent');
    expect(row.updatedAt.getTime()).toBe(before);
  });
});
