// Durable e-mail: sending records the message and queues it (pg-boss); the worker sends with
// retries. With the mail server down a quote is still "sent" (saved, waiting) and goes out once the
// server is back, exactly once; a new worker (a restart) picks up what an old one left; a message
// that used up its retries is shown as failed with the server's reason and can be sent again.
import { afterEach, describe, expect, it } from 'vitest';
import { JobEvent, MailMessage } from '../../server/db/models';
import { INTERRUPTED_REASON } from '../../server/modules/mail/mail-queue';
import { createTestContext, loginAs, type TestContext } from '../helpers/test-app';
import { quoteCompany, quoteJob } from './quotes-fixtures';

const open: TestContext[] = [];
afterEach(async () => {
  for (const c of open.splice(0)) await c.close();
});
async function context(env: Record<string, string> = {}) {
  const c = await createTestContext(env);
  open.push(c);
  return c;
}

/** Builds and sends a quote for a new job; answers the send response and the customer's address. */
async function sendQuote(ctx: TestContext) {
  const org = await quoteCompany();
  const email = `mailq-${Math.random().toString(36).slice(2, 9)}@example.com`;
  const { job } = await quoteJob(org, { email });
  const office = await loginAs(ctx.app, org.office);
  const quote = (await office.post(`/api/jobs/${job.id}/quotes`).send({})).body.quote;
  const res = await office.post(`/api/quotes/${quote.id}/send`).send({});
  return { res, email, job, org, office };
}

const messageTo = (email: string) => MailMessage.findOne({ where: { recipient: email } });
const eventFor = async (jobId: string) => (await JobEvent.findOne({ where: { jobId, kind: 'email_sent' } }))?.data as { status: string; text: string };

describe('durable e-mail', () => {
  it('answers success with the mail server down, keeps the quote waiting, and sends it once the server is back', async () => {
    const ctx = await context();
    const port = ctx.outbox.port;
    await ctx.outbox.stop();
    const { res, email, job } = await sendQuote(ctx);
    expect(res.status).toBeLessThan(300);
    // The first try has failed (connection refused) and the message waits for its retry.
    await expect.poll(async () => (await messageTo(email))?.attempts ?? 0, { timeout: 15_000 }).toBeGreaterThanOrEqual(1);
    const waiting = (await messageTo(email))!;
    expect(waiting.status).toBe('waiting');
    expect(waiting.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect((await eventFor(job.id)).status).toBe('waiting');
    expect((await eventFor(job.id)).text).toContain('waiting');

    await ctx.outbox.start(port);
    await ctx.outbox.waitFor((m) => m.envelopeTo.includes(email), 20_000);
    await expect.poll(async () => (await messageTo(email))?.status, { timeout: 10_000 }).toBe('sent');
    expect(ctx.outbox.messages().filter((m) => m.envelopeTo.includes(email))).toHaveLength(1);
    expect((await eventFor(job.id)).text).toContain('(sent)');
  }, 60_000);

  it('loses nothing on a restart: a message queued by a stopped instance is sent by the next one', async () => {
    const first = await context();
    await first.outbox.stop();
    const { res, email } = await sendQuote(first);
    expect(res.status).toBeLessThan(300);
    await expect.poll(async () => (await messageTo(email))?.attempts ?? 0, { timeout: 15_000 }).toBeGreaterThanOrEqual(1);
    await first.deps.mailQueue.stop(); // the instance goes away with the message still waiting
    expect((await messageTo(email))!.status).toBe('waiting');

    const second = await context(); // a new worker with a mail server that answers
    await second.outbox.waitFor((m) => m.envelopeTo.includes(email), 20_000);
    await expect.poll(async () => (await messageTo(email))?.status, { timeout: 10_000 }).toBe('sent');
    expect(second.outbox.messages().filter((m) => m.envelopeTo.includes(email))).toHaveLength(1);
  }, 60_000);

  it('marks a message failed with the reason after its last retry; the office sends it again, once', async () => {
    const ctx = await context({ MAIL_RETRY_LIMIT: '0' });
    const port = ctx.outbox.port;
    await ctx.outbox.stop();
    const { email, job, office } = await sendQuote(ctx);
    await expect.poll(async () => (await messageTo(email))?.status, { timeout: 15_000 }).toBe('failed');
    const failed = (await messageTo(email))!;
    expect(failed.lastError).toMatch(/ECONNREFUSED|connect/i);
    expect((await eventFor(job.id)).text).toContain('not sent');
    const listed = (await office.get('/api/mail/messages')).body.messages.find((m: { id: string }) => m.id === failed.id);
    expect(listed).toMatchObject({ status: 'failed', to: email });

    await ctx.outbox.start(port);
    // Two clicks at once: one is queued, the other is told it is no longer failed.
    const [a, b] = await Promise.all([office.post(`/api/mail/messages/${failed.id}/resend`), office.post(`/api/mail/messages/${failed.id}/resend`)]);
    expect([a.status, b.status].sort()).toEqual([202, 409]);
    await ctx.outbox.waitFor((m) => m.envelopeTo.includes(email), 20_000);
    await expect.poll(async () => (await messageTo(email))?.status, { timeout: 10_000 }).toBe('sent');
    expect(ctx.outbox.messages().filter((m) => m.envelopeTo.includes(email))).toHaveLength(1);
    expect((await office.post(`/api/mail/messages/${failed.id}/resend`)).status).toBe(409);
  }, 60_000);

  it('marks failed a waiting message whose last try was cut off (no job left), and only that one', async () => {
    // Arrange: two waiting messages with the worker stopped, so their jobs stay queued.
    const ctx = await context();
    await ctx.outbox.stop();
    await ctx.deps.mailQueue.stop();
    const cut = await sendQuote(ctx);
    const alive = await sendQuote(ctx);
    const [cutRow, aliveRow] = [(await messageTo(cut.email))!, (await messageTo(alive.email))!];
    expect([cutRow.status, aliveRow.status]).toEqual(['waiting', 'waiting']);
    // What pg-boss does when the instance sending a message's last try dies: the active job
    // expires with no retry left and ends failed, while the row (its update rolled back) still waits.
    const jobState = (id: string, state: string) =>
      ctx.deps.sequelize.query("UPDATE pgboss.job SET state = $1 WHERE name = 'mail-send' AND data->>'messageId' = $2", { bind: [state, id] });
    await jobState(cutRow.id, 'failed');

    // Act: the sweep (every instance runs it at start and then periodically); two at once as two instances would.
    const counts = await Promise.all([ctx.deps.mailQueue.failOrphans(), ctx.deps.mailQueue.failOrphans()]);

    // Assert: marked failed with the reason, in the list and the job history; the live one untouched.
    // (Each row goes to one sweep; a leftover of another test file in this database may count too.)
    expect(counts[0] + counts[1]).toBeGreaterThanOrEqual(1);
    const failed = (await messageTo(cut.email))!;
    expect(failed).toMatchObject({ status: 'failed', lastError: INTERRUPTED_REASON });
    expect((await eventFor(cut.job.id)).text).toContain(`not sent: ${INTERRUPTED_REASON}`);
    const listed = (await cut.office.get('/api/mail/messages')).body.messages.find((m: { id: string }) => m.id === failed.id);
    expect(listed).toMatchObject({ status: 'failed' });
    expect((await messageTo(alive.email))!.status).toBe('waiting');

    // The office sends it again: its new job is live, so a sweep leaves it waiting.
    expect((await cut.office.post(`/api/mail/messages/${failed.id}/resend`)).status).toBe(202);
    await ctx.deps.mailQueue.failOrphans();
    expect((await messageTo(cut.email))!.status).toBe('waiting');
  }, 60_000);

  it('keeps another company out of the list and the resend', async () => {
    const ctx = await context();
    const { email, org } = await sendQuote(ctx);
    await ctx.outbox.waitFor((m) => m.envelopeTo.includes(email));
    const row = (await messageTo(email))!;
    expect(row.organisationId).toBe(org.id);
    const other = await quoteCompany();
    const stranger = await loginAs(ctx.app, other.office);
    expect((await stranger.get('/api/mail/messages')).body.messages.some((m: { id: string }) => m.id === row.id)).toBe(false);
    expect((await stranger.post(`/api/mail/messages/${row.id}/resend`)).status).toBe(404);
    expect((await stranger.post('/api/mail/messages/not-an-id/resend')).status).toBe(422);
  });
});
