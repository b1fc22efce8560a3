// Company e-mail: Reply-To the company on customer mail, one office address, every job e-mail on
// the job's history, and a development Outbox that shows each company only the mail it sent.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobEvent } from '../../server/db/models';
import { mailOffice, sendCompanyMail } from '../../server/modules/mail/mail.service';
import { loadCompanySettings } from '../../server/modules/settings/settings.service';
import { addDaysIso, mondayOf, todayIso } from '../../shared/dates';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;
let other: TestOrg;
const companyEmail = `hello-${Date.now()}@hearthfold.example.com`;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  other = await createOrgWithUsers(ctx);
  await (await loadCompanySettings(org.id)).update({ email: companyEmail });
});
afterAll(async () => {
  await ctx?.close();
});

const emailEvents = async (jobId: string) =>
  (await JobEvent.findAll({ where: { jobId, kind: 'email_sent' } })).map((e) => (e.data as { to: string; purpose: string }).purpose).sort();

describe('company e-mail', () => {
  it('books a job: the customer may reply to the company, and both e-mails are on the job history', async () => {
    const customerEmail = `robin-${Date.now()}@example.com`;
    const { job, customer } = await createJob(org, { stage: 'accepted' });
    await customer.update({ email: customerEmail });
    const office = await loginAs(ctx.app, org.office);
    const date = addDaysIso(mondayOf(todayIso()), 8);
    const res = await office.post('/api/schedule/assign').send({ jobId: job.id, installerId: org.installer.id, date, allowOverCapacity: true });
    expect(res.status).toBe(200);
    const toCustomer = await ctx.outbox.waitFor((m) => m.envelopeTo.includes(customerEmail));
    expect(toCustomer.replyTo).toBe(companyEmail);
    expect(toCustomer.text).toContain('reply to this e-mail');
    const toInstaller = await ctx.outbox.waitFor((m) => m.envelopeTo.includes(org.installer.email) && m.subject.includes(job.reference));
    expect(toInstaller.replyTo).toBe('');
    expect(await emailEvents(job.id)).toEqual(['booking', 'booking_installer']);
  });

  it('sends office notices to the company address, records them on the job, and shows them in the Outbox', async () => {
    const { job } = await createJob(org, { stage: 'quoted' });
    await mailOffice(
      ctx.deps,
      { organisationId: org.id, jobId: job.id, userId: null, purpose: 'quote_answer' },
      `Quote accepted ${job.reference}`,
      'Accepted.',
    );
    const notice = await ctx.outbox.waitFor((m) => m.subject === `Quote accepted ${job.reference}`);
    expect(notice.envelopeTo).toEqual([companyEmail]);
    expect(await emailEvents(job.id)).toEqual(['quote_answer']);
    const office = await loginAs(ctx.app, org.office);
    const listed = (await office.get('/api/dev/outbox')).body.messages.map((m: { subject: string }) => m.subject);
    expect(listed).toContain(`Quote accepted ${job.reference}`);
  });

  it('never shows one company the mail another company sent, even to an address both know', async () => {
    const shared = `shared-${Date.now()}@example.com`;
    await sendCompanyMail(
      ctx.deps,
      { organisationId: other.id, jobId: null, userId: null, purpose: 'test', audience: 'customer' },
      { to: shared, subject: `Private to the other company ${shared}`, text: 'secret link' },
    );
    await sendCompanyMail(
      ctx.deps,
      { organisationId: org.id, jobId: null, userId: null, purpose: 'test', audience: 'customer' },
      { to: shared, subject: `Ours ${shared}`, text: 'hello' },
    );
    await ctx.outbox.waitFor((m) => m.subject === `Ours ${shared}`);
    await ctx.outbox.waitFor((m) => m.subject === `Private to the other company ${shared}`);
    const office = await loginAs(ctx.app, org.office);
    const listed = (await office.get('/api/dev/outbox')).body.messages.map((m: { subject: string; replyTo: string }) => [m.subject, m.replyTo]);
    expect(listed).toContainEqual([`Ours ${shared}`, companyEmail]);
    expect(listed.map((l: string[]) => l[0])).not.toContain(`Private to the other company ${shared}`);
  });
});
