// The deposit is said before the customer accepts: on the quote's data, the public page's data,
// the PDF and the e-mail, all from the company's deposit settings.
import { PDFParse } from 'pdf-parse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { applyRateBp } from '../../shared/quote/money';
import request from 'supertest';
import { createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { binary, quoteCompany, quoteJob } from './quotes-fixtures';

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await quoteCompany();
});
afterAll(async () => {
  await ctx?.close();
});

const gbp = (m: number) => new Intl.NumberFormat('en-GB', { style: 'currency', currency: 'GBP' }).format(m / 100);

describe('deposit before acceptance', () => {
  it('names the deposit (25 % of the total) on the quote, its PDF, its e-mail and the customer page', async () => {
    const office = await loginAs(ctx.app, org.office);
    expect(
      (await office.put('/api/payments/settings').send({ depositMode: 'percent', depositPercentBp: 2500, depositFixedMinor: null, paymentTermsDays: 14 }))
        .status,
    ).toBe(200);
    const email = `deposit-${Date.now()}@example.com`;
    const { job } = await quoteJob(org, { email });
    const q = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
    // 25 % of the gross, rounded half up to the penny like every rate (shared/quote/money.ts).
    const expected = applyRateBp(q.totals.grossMinor, 2500);
    expect(q.deposit).toEqual({ amountMinor: expected, percentBp: 2500 });
    const sentence = `A deposit of ${gbp(expected)} (25% of the total) is paid by card when you accept this quote`;

    const pdf = await office.get(`/api/quotes/${q.id}/pdf`).buffer(true).parse(binary);
    const text = (await new PDFParse({ data: new Uint8Array(pdf.body) }).getText()).text.replace(/\s+/g, ' ');
    expect(text).toContain(sentence);
    expect(text).not.toContain('rounded to the penny');

    expect((await office.post(`/api/quotes/${q.id}/send`).send({})).status).toBe(200);
    const mail = await ctx.outbox.waitFor((m) => m.envelopeTo.includes(email));
    expect(mail.text.replace(/\s+/g, ' ')).toContain(sentence);

    const link = mail.links.find((l) => new URL(l).pathname.startsWith('/q/'))!;
    const token = decodeURIComponent(new URL(link).pathname.slice('/q/'.length));
    const pub = await request(ctx.app).get(`/api/public/quotes/${encodeURIComponent(token)}`);
    expect(pub.status).toBe(200);
    expect(pub.body.quote.deposit).toEqual({ amountMinor: expected, percentBp: 2500 });
  });

  it('says nothing of a deposit when the company asks none', async () => {
    const office = await loginAs(ctx.app, org.office);
    await office.put('/api/payments/settings').send({ depositMode: 'none', depositPercentBp: null, depositFixedMinor: null, paymentTermsDays: 14 });
    const { job } = await quoteJob(org);
    const q = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
    expect(q.deposit).toBeNull();
  });
});
