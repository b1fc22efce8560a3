// Sending a quote and the customer's private link: e-mail with the PDF, accept once, second use,
// expired, tampered and replaced links, the office notified, every e-mail on the job's timeline.
import { simpleParser } from 'mailparser';
import { PDFParse } from 'pdf-parse';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Job } from '../../server/db/models';
import { Quote } from '../../server/db/models/quote';
import { endOfDayEpochSec, signQuoteLink } from '../../server/modules/quotes/quote-link';
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

async function sentQuote(customerEmail: string) {
  const { job } = await quoteJob(org, { email: customerEmail, customerName: 'Cressida Vane' });
  const office = await loginAs(ctx.app, org.office);
  const q = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
  const sent = await office.post(`/api/quotes/${q.id}/send`).send({});
  expect(sent.status).toBe(200);
  const mail = await ctx.outbox.waitFor((m) => m.to.includes(customerEmail));
  const link = mail.links.find((l) => new URL(l).pathname.startsWith('/q/'))!;
  const token = decodeURIComponent(new URL(link).pathname.slice('/q/'.length));
  return { job, office, quote: sent.body.quote, mail, link, token };
}

describe('sending a quote', () => {
  it('e-mails the customer the PDF and a private link that opens the quote without signing in', async () => {
    const { job, office, quote, mail, link, token } = await sentQuote('cressida.send@example.com');
    expect(quote.status).toBe('sent');
    expect(link.startsWith(`${ctx.config.appUrl}/q/`)).toBe(true);

    const parsed = await simpleParser(mail.raw);
    const pdf = parsed.attachments.find((a) => a.contentType === 'application/pdf');
    expect(pdf?.filename).toBe(`quote-${quote.number}.pdf`);
    const text = (await new PDFParse({ data: new Uint8Array(pdf!.content) }).getText()).text;
    expect(text).toContain('Cressida Vane');
    expect(text.replace(/\s+/g, '')).toContain(link.replace(/\s+/g, ''));

    const pub = await request(ctx.app).get(`/api/public/quotes/${encodeURIComponent(token)}`);
    expect(pub.status).toBe(200);
    expect(pub.body.quote.totals.grossMinor).toBe(quote.totals.grossMinor);
    expect(pub.body.quote.customerName).toBe('Cressida Vane');
    expect(JSON.stringify(pub.body)).not.toMatch(/costMinor|marginMinor/); // no costs for customers
    const pubPdf = await request(ctx.app)
      .get(`/api/public/quotes/${encodeURIComponent(token)}/pdf`)
      .buffer(true)
      .parse(binary);
    expect(pubPdf.status).toBe(200);
    expect(pubPdf.body.subarray(0, 5).toString()).toBe('%PDF-');

    expect((await Job.findByPk(job.id))!.stage).toBe('quoted');
    const events = (await office.get(`/api/jobs/${job.id}/events`)).body;
    const list = (events.events ?? events) as Array<{ kind: string; data: { to?: string; purpose?: string } }>;
    expect(list.some((e) => e.kind === 'email_sent' && e.data.to === 'cressida.send@example.com' && e.data.purpose === 'quote')).toBe(true);
  });

  it('refuses to send when the customer has no e-mail address', async () => {
    const { job } = await quoteJob(org, { email: '' });
    const office = await loginAs(ctx.app, org.office);
    const q = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
    const res = await office.post(`/api/quotes/${q.id}/send`).send({});
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].path).toBe('customer.email');
  });
});

describe('the customer answering', () => {
  it('accepts once: the quote and the job become accepted and the office is e-mailed; a second use changes nothing', async () => {
    const { job, quote, token } = await sentQuote('cressida.accept@example.com');
    const t = encodeURIComponent(token);
    expect((await request(ctx.app).post(`/api/public/quotes/${t}/accept`).send({ name: 'Cressida Vane' })).status).toBe(422); // terms not confirmed
    const ok = await request(ctx.app).post(`/api/public/quotes/${t}/accept`).send({ name: 'Cressida Vane', acceptTerms: true });
    expect(ok.status).toBe(200);
    expect(ok.body.quote).toMatchObject({ status: 'accepted', acceptedName: 'Cressida Vane' });
    expect((await Job.findByPk(job.id))!.stage).toBe('accepted');
    const note = await ctx.outbox.waitFor((m) => m.subject.includes(`Quote ${quote.number} accepted`));
    expect(note.to).toContain('lofts.example.com');

    const before = await Quote.findByPk(quote.id);
    const again = await request(ctx.app).post(`/api/public/quotes/${t}/accept`).send({ name: 'Someone Else', acceptTerms: true });
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('link_used');
    const decline = await request(ctx.app).post(`/api/public/quotes/${t}/decline`).send({ reason: 'changed my mind' });
    expect(decline.status).toBe(409);
    const after = await Quote.findByPk(quote.id);
    expect(after!.acceptedName).toBe('Cressida Vane');
    expect(after!.updatedAt.getTime()).toBe(before!.updatedAt.getTime());
    // Still viewable, showing it was accepted.
    expect((await request(ctx.app).get(`/api/public/quotes/${t}`)).body.quote.status).toBe('accepted');
  });

  it('lets only one of two simultaneous acceptances through', async () => {
    const { quote, token } = await sentQuote('cressida.race@example.com');
    const t = encodeURIComponent(token);
    const [a, b] = await Promise.all([
      request(ctx.app).post(`/api/public/quotes/${t}/accept`).send({ name: 'First Tab', acceptTerms: true }),
      request(ctx.app).post(`/api/public/quotes/${t}/accept`).send({ name: 'Second Tab', acceptTerms: true }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const winner = a.status === 200 ? 'First Tab' : 'Second Tab';
    expect((await Quote.findByPk(quote.id))!.acceptedName).toBe(winner);
  });

  it('declines with an optional reason and tells the office', async () => {
    const { job, quote, token } = await sentQuote('cressida.decline@example.com');
    const res = await request(ctx.app)
      .post(`/api/public/quotes/${encodeURIComponent(token)}/decline`)
      .send({ reason: "Going with a neighbour's firm" });
    expect(res.status).toBe(200);
    expect(res.body.quote.status).toBe('declined');
    expect((await Job.findByPk(job.id))!.stage).toBe('declined');
    const note = await ctx.outbox.waitFor((m) => m.subject.includes(`Quote ${quote.number} declined`));
    expect(note.text).toContain('neighbour');
  });

  it('refuses an expired link and changes nothing', async () => {
    const { quote, token } = await sentQuote('cressida.expired@example.com');
    const row = (await Quote.findByPk(quote.id))!;
    // Same quote and nonce, signed with the server's secret, but expired yesterday.
    const stale = signQuoteLink({ quoteId: quote.id, nonce: row.linkNonce!, exp: Math.floor(Date.now() / 1000) - 86_400 }, ctx.config.sessionSecret);
    const res = await request(ctx.app)
      .post(`/api/public/quotes/${encodeURIComponent(stale)}/accept`)
      .send({ name: 'Cressida Vane', acceptTerms: true });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('link_expired');
    expect((await Quote.findByPk(quote.id))!.status).toBe('sent');

    // A quote past its valid-until day expires even through a link that is otherwise fine.
    await Quote.update({ validUntil: '2020-01-01' }, { where: { id: quote.id } });
    const late = await request(ctx.app).get(`/api/public/quotes/${encodeURIComponent(token)}`);
    expect(late.status).toBe(410);
    // Reading derives the status and writes nothing; the customer's answer (a write) stores it.
    expect((await Quote.findByPk(quote.id))!.status).toBe('sent');
    const answer = await request(ctx.app)
      .post(`/api/public/quotes/${encodeURIComponent(token)}/accept`)
      .send({ name: 'Cressida Vane', acceptTerms: true });
    expect(answer.status).toBe(410);
    expect((await Quote.findByPk(quote.id))!.status).toBe('expired');
  });

  it('refuses a tampered link and changes nothing', async () => {
    const { quote, token } = await sentQuote('cressida.tampered@example.com');
    const [payload, sig] = token.split('.');
    const flipped = `${payload}.${sig.slice(0, -2)}${sig.endsWith('AA') ? 'BB' : 'AA'}`;
    const otherPayload = Buffer.from(
      Buffer.from(payload, 'base64url')
        .toString()
        .replace(/.$/, (c) => (c === '1' ? '2' : '1')),
    ).toString('base64url');
    const forged = signQuoteLink({ quoteId: quote.id, nonce: 'guessed', exp: endOfDayEpochSec('2099-01-01') }, 'not-the-server-secret');
    for (const bad of [flipped, `${otherPayload}.${sig}`, forged, 'nonsense-token-value']) {
      const res = await request(ctx.app)
        .post(`/api/public/quotes/${encodeURIComponent(bad)}/accept`)
        .send({ name: 'Mallory', acceptTerms: true });
      expect(res.status, bad).toBe(404);
      expect(res.body.error.code).toBe('link_invalid');
    }
    expect((await Quote.findByPk(quote.id))!.status).toBe('sent');
  });

  it('keeps the old version when a sent quote is edited, and its link then says it was replaced', async () => {
    const { office, quote, token } = await sentQuote('cressida.version@example.com');
    const edited = await office.patch(`/api/quotes/${quote.id}`).send({ notes: 'Added a note after a call' });
    expect(edited.status).toBe(200);
    expect(edited.body.quote).toMatchObject({ number: quote.number, version: 2, status: 'draft' });
    expect(edited.body.quote.id).not.toBe(quote.id);
    expect(edited.body.quote.lines).toHaveLength(quote.lines.length);
    const old = await office.get(`/api/quotes/${quote.id}`);
    expect(old.body.quote.status).toBe('superseded');
    expect(old.body.quote.totals.grossMinor).toBe(quote.totals.grossMinor);
    expect(old.body.quote.versions.map((v: { version: number }) => v.version)).toEqual([1, 2]);
    const res = await request(ctx.app)
      .post(`/api/public/quotes/${encodeURIComponent(token)}/accept`)
      .send({ name: 'Cressida Vane', acceptTerms: true });
    expect(res.status).toBe(410);
    expect(res.body.error.code).toBe('link_replaced');
  });
});
