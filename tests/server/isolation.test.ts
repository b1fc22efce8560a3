// Company isolation: another company's ids behave exactly like ids that do not exist (404).
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let ours: TestOrg;
let theirs: TestOrg;
let theirJob: Awaited<ReturnType<typeof createJob>>;
let office: Awaited<ReturnType<typeof loginAs>>;

beforeAll(async () => {
  ctx = await createTestContext();
  ours = await createOrgWithUsers(ctx);
  theirs = await createOrgWithUsers(ctx);
  await createJob(ours, { customerName: 'Our Own Customer' });
  theirJob = await createJob(theirs, { customerName: 'Their Private Customer', assignedInstallerId: theirs.installer.id });
  office = await loginAs(ctx.app, ours.office);
});
afterAll(async () => ctx?.close());

describe('another company', () => {
  it.each([
    ['GET', () => `/api/jobs/${theirJob.job.id}`],
    ['PATCH', () => `/api/jobs/${theirJob.job.id}`],
    ['GET', () => `/api/jobs/${theirJob.job.id}/events`],
    ['POST', () => `/api/jobs/${theirJob.job.id}/spaces`],
    ['GET', () => `/api/customers/${theirJob.customer.id}`],
    ['PATCH', () => `/api/customers/${theirJob.customer.id}`],
    ['DELETE', () => `/api/customers/${theirJob.customer.id}`],
    ['GET', () => `/api/spaces/${theirJob.space.id}`],
    ['PATCH', () => `/api/spaces/${theirJob.space.id}`],
    ['DELETE', () => `/api/spaces/${theirJob.space.id}`],
    ['GET', () => `/api/users/${theirs.estimator.id}`],
    ['PATCH', () => `/api/users/${theirs.estimator.id}`],
  ])('%s %s is a 404, the same as an id that does not exist', async (method, url) => {
    const body = method === 'PATCH' ? { name: 'Taken Over' } : method === 'POST' ? { name: 'Sneaky loft' } : undefined;
    const send = (u: string) => {
      const req = office[method.toLowerCase() as 'get' | 'patch' | 'post' | 'delete'](u);
      return body ? req.send(body) : req;
    };
    const res = await send(url());
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    const missing = await send(url().replace(/[0-9a-f-]{36}/, randomUUID()));
    expect(missing.status).toBe(404);
    expect(missing.body.error.message).toBe(res.body.error.message);
  });

  it('never appears in lists or searches', async () => {
    const jobs = await office.get('/api/jobs').query({ q: 'Their Private' });
    expect(jobs.status).toBe(200);
    expect(jobs.body.jobs).toEqual([]);
    const all = await office.get('/api/jobs');
    expect(all.body.jobs.map((j: { id: string }) => j.id)).not.toContain(theirJob.job.id);
    const customers = await office.get('/api/customers');
    expect(customers.body.customers.map((c: { name: string }) => c.name)).not.toContain('Their Private Customer');
    const users = await office.get('/api/users');
    const emails = users.body.users.map((u: { email: string }) => u.email);
    expect(emails).toContain(ours.estimator.email);
    expect(emails).not.toContain(theirs.estimator.email);
  });

  it('cannot be linked: a job for their customer or their installer is refused, naming the field', async () => {
    const badCustomer = await office
      .post('/api/jobs')
      .send({ customerId: theirJob.customer.id, propertyAddress: { line1: '1 A St', town: 'B', postcode: 'C1 1CC' } });
    expect(badCustomer.status).toBe(422);
    expect(badCustomer.body.error.details[0].path).toBe('customerId');
    const ourJob = await createJob(ours);
    const badInstaller = await office.patch(`/api/jobs/${ourJob.job.id}`).send({ assignedInstallerId: theirs.installer.id });
    expect(badInstaller.status).toBe(422);
    expect(badInstaller.body.error.details[0].path).toBe('assignedInstallerId');
  });

  it('their data is unchanged after our attempts', async () => {
    const theirOffice = await loginAs(ctx.app, theirs.office);
    const res = await theirOffice.get(`/api/jobs/${theirJob.job.id}`);
    expect(res.status).toBe(200);
    expect(res.body.job.customer.name).toBe('Their Private Customer');
    expect(res.body.job.spaces.map((s: { name: string }) => s.name)).toEqual(['Main loft']);
  });
});
