// Bad bodies get 422 JSON naming the field, from the same shared zod schemas the client forms use.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;
let office: Awaited<ReturnType<typeof loginAs>>;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  office = await loginAs(ctx.app, org.office);
});
afterAll(async () => ctx?.close());

const paths = (res: { body: { error: { details: Array<{ path: string }> } } }) => res.body.error.details.map((d) => d.path);

describe('validation errors', () => {
  it('name every missing customer field', async () => {
    const res = await office.post('/api/customers').send({ name: '', address: { line1: '', town: '' } });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('validation_failed');
    expect(paths(res)).toEqual(expect.arrayContaining(['name', 'address.line1', 'address.town', 'address.postcode']));
    expect(res.body.error.message).toMatch(/name: enter the customer name/);
  });

  it('name a bad e-mail', async () => {
    const res = await office.post('/api/customers').send({ name: 'A', email: 'nope', address: { line1: 'a', town: 'b', postcode: 'c' } });
    expect(res.status).toBe(422);
    expect(paths(res)).toEqual(['email']);
  });

  it('name a bad date and an unknown stage on a job', async () => {
    const { customer } = await createJob(org);
    const res = await office.post('/api/jobs').send({
      customerId: customer.id,
      propertyAddress: { line1: '1 Lane', town: 'T', postcode: 'P' },
      stage: 'finished',
      installDate: '31/01/2027',
    });
    expect(res.status).toBe(422);
    expect(paths(res)).toEqual(expect.arrayContaining(['stage', 'installDate']));
  });

  it('name a bad id in the URL', async () => {
    const res = await office.get('/api/jobs/not-a-uuid');
    expect(res.status).toBe(422);
    expect(paths(res)).toEqual(['id']);
  });

  it('name a bad query parameter', async () => {
    const res = await office.get('/api/jobs').query({ sort: 'colour' });
    expect(res.status).toBe(422);
    expect(paths(res)).toEqual(['sort']);
  });

  it('name the invite fields', async () => {
    const res = await office.post('/api/users').send({ email: 'x', name: '', role: 'boss' });
    expect(res.status).toBe(422);
    expect(paths(res)).toEqual(expect.arrayContaining(['email', 'name', 'role']));
  });

  it('trim text and keep untouched fields on a patch', async () => {
    const created = await office
      .post('/api/customers')
      .send({ name: '  Ada Lovell  ', email: 'ada@example.com', phone: '01632 960999', address: { line1: '1 Lane', town: 'T', postcode: 'P1 1PP' } });
    expect(created.status).toBe(201);
    expect(created.body.customer.name).toBe('Ada Lovell');
    const patched = await office.patch(`/api/customers/${created.body.customer.id}`).send({ name: 'Ada Lovell-Price' });
    expect(patched.status).toBe(200);
    expect(patched.body.customer).toMatchObject({ name: 'Ada Lovell-Price', email: 'ada@example.com', phone: '01632 960999' });
  });
});
