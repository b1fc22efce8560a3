// Races on one sent quote: the customer accepting while the office edits it, and two office edits at
// once. Each pair is fired together (Promise.all) several times; the invariants are checked on the rows.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Customer, Job } from '../../server/db/models';
import { Quote } from '../../server/db/models/quote';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { createAcceptedQuote } from './payments-fixtures';

let ctx: TestContext;
let org: TestOrg;
let office: Awaited<ReturnType<typeof loginAs>>;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  office = await loginAs(ctx.app, org.office);
});
afterAll(async () => ctx?.close());

async function sentQuote() {
  const { job } = await createJob(org, { stage: 'quoted' });
  const { quote, link } = await createAcceptedQuote(org.id, job.id, ctx.config.sessionSecret, { status: 'sent' });
  return { job, quote, link };
}

const TRIALS = 6;

describe('accepting while the office edits the sent quote', () => {
  it('never loses an acceptance: either the acceptance stands and the edit is refused, or the edit wins and the link says replaced', async () => {
    let accepts = 0;
    let edits = 0;
    for (let i = 0; i < TRIALS; i++) {
      const { job, quote, link } = await sentQuote();
      const [acc, edit] = await Promise.all([
        request(ctx.app)
          .post(`/api/public/quotes/${encodeURIComponent(link)}/accept`)
          .send({ name: 'Perpetua Lowe', acceptTerms: true }),
        office.patch(`/api/quotes/${quote.id}`).send({ notes: `office change ${i}` }),
      ]);
      const row = (await Quote.findByPk(quote.id))!;
      const versions = await Quote.count({ where: { organisationId: org.id, number: quote.number } });
      if (acc.status === 200) {
        accepts++;
        expect(row.status).toBe('accepted');
        expect(edit.status).toBe(409);
        expect(edit.body.error.code).toBe('quote_final');
        expect(versions).toBe(1);
        expect((await Job.findByPk(job.id))!.stage).toBe('accepted');
      } else {
        edits++;
        expect(edit.status).toBe(200);
        expect(acc.status).toBe(410);
        expect(acc.body.error.code).toBe('link_replaced');
        expect(row.status).toBe('superseded');
        expect(versions).toBe(2);
        expect((await Job.findByPk(job.id))!.stage).toBe('quoted');
      }
    }
    expect(accepts + edits).toBe(TRIALS);
  });
});

describe('two office edits of one sent quote at once', () => {
  it('makes one new version and answers the other 409, never 500', async () => {
    for (let i = 0; i < TRIALS; i++) {
      const { quote } = await sentQuote();
      const [a, b] = await Promise.all([
        office.patch(`/api/quotes/${quote.id}`).send({ notes: 'first desk' }),
        office.patch(`/api/quotes/${quote.id}`).send({ notes: 'second desk' }),
      ]);
      expect([a.status, b.status].sort()).toEqual([200, 409]);
      const loser = a.status === 409 ? a : b;
      expect(loser.body.error.code).toBe('quote_superseded');
      expect(await Quote.count({ where: { organisationId: org.id, number: quote.number } })).toBe(2);
      expect((await Quote.findByPk(quote.id))!.status).toBe('superseded');
    }
  });
});

describe('sending the quote again while the customer accepts', () => {
  it('never overwrites an acceptance with a new link', async () => {
    for (let i = 0; i < 3; i++) {
      const { job, quote, link } = await sentQuote();
      await Customer.update({ email: `resend-${i}@example.com` }, { where: { id: job.customerId } });
      const [acc, send] = await Promise.all([
        request(ctx.app)
          .post(`/api/public/quotes/${encodeURIComponent(link)}/accept`)
          .send({ name: 'Perpetua Lowe', acceptTerms: true }),
        office.post(`/api/quotes/${quote.id}/send`).send({}),
      ]);
      const row = (await Quote.findByPk(quote.id))!;
      if (acc.status === 200) {
        expect(row.status).toBe('accepted');
        expect(send.status).toBe(409);
      } else {
        expect(send.status).toBe(200);
        expect(acc.body.error.code).toBe('link_replaced');
        expect(row.status).toBe('sent');
      }
    }
  });
});
