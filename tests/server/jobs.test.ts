// Jobs: references, search, stage filter, sort, timeline, assignment rules.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JobEvent } from '../../server/db/models';
import { createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;
let office: Awaited<ReturnType<typeof loginAs>>;
let estimator: Awaited<ReturnType<typeof loginAs>>;
const customers: Record<string, string> = {};

const address = (line1: string, postcode: string) => ({ line1, town: 'Fenwick', postcode });

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  office = await loginAs(ctx.app, org.office);
  estimator = await loginAs(ctx.app, org.estimator);
  for (const name of ['Agnes Birch', 'Zeno Quill', 'Maud Fairweather']) {
    const res = await office.post('/api/customers').send({ name, address: address('1 Any Road', 'FW1 1AA') });
    customers[name] = res.body.customer.id;
  }
});
afterAll(async () => ctx?.close());

describe('creating jobs', () => {
  it('numbers them per company and year: Q-YYYY-0001, Q-YYYY-0002 ...', async () => {
    const year = new Date().getUTCFullYear();
    const a = await estimator.post('/api/jobs').send({ customerId: customers['Agnes Birch'], propertyAddress: address('3 Birch Walk', 'FW1 3BW') });
    const b = await estimator
      .post('/api/jobs')
      .send({ customerId: customers['Zeno Quill'], propertyAddress: address('9 Quill Street', 'FW9 9QS'), stage: 'surveyed' });
    expect(a.status).toBe(201);
    expect(a.body.job.reference).toBe(`JOB-${year}-0001`);
    expect(b.body.job.reference).toBe(`JOB-${year}-0002`);
    expect(a.body.job).toMatchObject({ stage: 'enquiry', assignedInstaller: null, installDate: null, spaces: [] });
    // another company starts its own numbering
    const other = await createOrgWithUsers(ctx);
    const otherOffice = await loginAs(ctx.app, other.office);
    const c = await otherOffice.post('/api/customers').send({ name: 'Other Co Customer', address: address('1 Elsewhere', 'EL1 1EE') });
    const otherJob = await otherOffice.post('/api/jobs').send({ customerId: c.body.customer.id, propertyAddress: address('1 Elsewhere', 'EL1 1EE') });
    expect(otherJob.body.job.reference).toBe(`JOB-${year}-0001`);
  });

  it('lets only the office assign an installer and a date', async () => {
    const body = {
      customerId: customers['Maud Fairweather'],
      propertyAddress: address('12 Fair Lane', 'FW2 2FL'),
      stage: 'scheduled',
      assignedInstallerId: org.installer.id,
      installDate: '2027-03-01',
    };
    expect((await estimator.post('/api/jobs').send(body)).status).toBe(403);
    const res = await office.post('/api/jobs').send(body);
    expect(res.status).toBe(201);
    expect(res.body.job.assignedInstaller).toEqual({ id: org.installer.id, name: expect.any(String) });
    expect(res.body.job.installDate).toBe('2027-03-01');
  });

  it('refuses assigning someone who is not an installer', async () => {
    const res = await office
      .post('/api/jobs')
      .send({ customerId: customers['Maud Fairweather'], propertyAddress: address('1 X', 'FW1'), assignedInstallerId: org.estimator.id });
    expect(res.status).toBe(422);
    expect(res.body.error.details[0].path).toBe('assignedInstallerId');
  });
});

describe('listing jobs', () => {
  it('searches by customer name, reference, street and postcode, case-insensitively', async () => {
    const byName = await office.get('/api/jobs').query({ q: 'zeno' });
    expect(byName.body.jobs.map((j: { customer: { name: string } }) => j.customer.name)).toEqual(['Zeno Quill']);
    const byPostcode = await office.get('/api/jobs').query({ q: 'fw1 3bw' });
    expect(byPostcode.body.jobs).toHaveLength(1);
    expect(byPostcode.body.jobs[0].propertyAddress.line1).toBe('3 Birch Walk');
    const ref = byName.body.jobs[0].reference;
    const byRef = await office.get('/api/jobs').query({ q: ref });
    expect(byRef.body.jobs.map((j: { reference: string }) => j.reference)).toEqual([ref]);
    const wildcard = await office.get('/api/jobs').query({ q: '%' });
    expect(wildcard.body.jobs).toEqual([]);
  });

  it('filters by stage', async () => {
    const res = await office.get('/api/jobs').query({ stage: 'surveyed' });
    expect(res.body.jobs.length).toBeGreaterThan(0);
    for (const j of res.body.jobs) expect(j.stage).toBe('surveyed');
  });

  it('sorts by customer and by stage order', async () => {
    const asc = await office.get('/api/jobs').query({ sort: 'customer', dir: 'asc' });
    const names = asc.body.jobs.map((j: { customer: { name: string } }) => j.customer.name);
    expect(names).toEqual([...names].sort((a: string, b: string) => a.localeCompare(b)));
    const stages = (await office.get('/api/jobs').query({ sort: 'stage', dir: 'asc' })).body.jobs.map((j: { stage: string }) => j.stage);
    const order = ['enquiry', 'surveyed', 'quoted', 'accepted', 'scheduled', 'installed', 'closed', 'declined'];
    const idx = stages.map((s: string) => order.indexOf(s));
    expect(idx).toEqual([...idx].sort((a, b) => a - b));
    expect(new Set(stages).size).toBeGreaterThan(1);
  });
});

describe('changing a job', () => {
  it('changes only the fields sent and records the timeline', async () => {
    const created = await estimator
      .post('/api/jobs')
      .send({ customerId: customers['Agnes Birch'], propertyAddress: address('5 Timeline Row', 'FW5 5TR'), notes: 'keep me' });
    const id = created.body.job.id;
    const moved = await estimator.patch(`/api/jobs/${id}`).send({ stage: 'surveyed' });
    expect(moved.status).toBe(200);
    expect(moved.body.job).toMatchObject({ stage: 'surveyed', notes: 'keep me' });
    const noted = await estimator.patch(`/api/jobs/${id}`).send({ accessNotes: 'ladder in shed' });
    expect(noted.body.job.stage).toBe('surveyed');
    await office.patch(`/api/jobs/${id}`).send({ assignedInstallerId: org.installer.id, installDate: '2027-04-02' });

    const events = await estimator.get(`/api/jobs/${id}/events`);
    expect(events.status).toBe(200);
    expect(events.body.events.map((e: { kind: string }) => e.kind)).toEqual(['created', 'stage_changed', 'updated', 'assigned', 'scheduled']);
    expect(events.body.events[1]).toMatchObject({ data: { from: 'enquiry', to: 'surveyed' }, user: { id: org.estimator.id } });
  });

  it('keeps events written in the same instant in the order they were written', async () => {
    const created = await estimator.post('/api/jobs').send({ customerId: customers['Zeno Quill'], propertyAddress: address('7 Tie Lane', 'FW7 7TL') });
    const id = created.body.job.id;
    // One save that assigns and schedules writes both events within a millisecond; here the tie is certain.
    const at = new Date('2027-01-05T09:00:00.000Z');
    const kinds = ['scheduled', 'assigned', 'updated', 'stage_changed', 'assigned', 'scheduled'];
    for (const kind of kinds) await JobEvent.create({ organisationId: org.id, jobId: id, userId: org.office.id, kind, createdAt: at });
    const events = await estimator.get(`/api/jobs/${id}/events`);
    expect(events.body.events.map((e: { kind: string }) => e.kind)).toEqual(['created', ...kinds]);
  });

  it('lists the company’s active installers for assignment', async () => {
    const res = await office.get('/api/jobs/installers');
    expect(res.body.installers).toEqual([{ id: org.installer.id, name: expect.any(String) }]);
  });
});
