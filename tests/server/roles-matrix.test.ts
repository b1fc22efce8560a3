// The role × route matrix: each role on each route group, against the real app and database.
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Role } from '../../shared/auth/roles';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

let ctx: TestContext;
let org: TestOrg;
const agents: Partial<Record<Role, Awaited<ReturnType<typeof loginAs>>>> = {};
let assignedJobId: string;
let assignedSpaceId: string;
let unassignedJobId: string;
let toAssignJobId: string;
let customerId: string;

const newCustomer = () => ({ name: 'Matrix Customer', address: { line1: '2 Grid Lane', town: 'Matrixton', postcode: 'MX1 1AA' } });
const newJob = () => ({ customerId, propertyAddress: { line1: '2 Grid Lane', town: 'Matrixton', postcode: 'MX1 1AA' } });

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  const a = await createJob(org, { stage: 'scheduled', assignedInstallerId: org.installer.id });
  assignedJobId = a.job.id;
  assignedSpaceId = a.space.id;
  customerId = a.customer.id;
  unassignedJobId = (await createJob(org, { stage: 'quoted' })).job.id;
  toAssignJobId = (await createJob(org, { stage: 'accepted' })).job.id;
  for (const role of ['office', 'estimator', 'installer'] as const) agents[role] = await loginAs(ctx.app, org[role]);
});
afterAll(async () => ctx?.close());

type Call = { name: string; run: (agent: ReturnType<typeof request.agent> | ReturnType<typeof request>) => Promise<request.Response> };
const calls: Record<string, Call> = {
  listUsers: { name: 'GET /api/users', run: (a) => a.get('/api/users') },
  inviteUser: {
    name: 'POST /api/users',
    run: (a) => a.post('/api/users').send({ email: `matrix-${Math.random().toString(36).slice(2)}@test.example.com`, name: 'New Person', role: 'estimator' }),
  },
  listCustomers: { name: 'GET /api/customers', run: (a) => a.get('/api/customers') },
  createCustomer: { name: 'POST /api/customers', run: (a) => a.post('/api/customers').send(newCustomer()) },
  listJobs: { name: 'GET /api/jobs', run: (a) => a.get('/api/jobs') },
  createJob: { name: 'POST /api/jobs', run: (a) => a.post('/api/jobs').send(newJob()) },
  getAssignedJob: { name: 'GET /api/jobs/:assigned', run: (a) => a.get(`/api/jobs/${assignedJobId}`) },
  getUnassignedJob: { name: 'GET /api/jobs/:unassigned', run: (a) => a.get(`/api/jobs/${unassignedJobId}`) },
  patchJob: { name: 'PATCH /api/jobs/:id', run: (a) => a.patch(`/api/jobs/${unassignedJobId}`).send({ notes: 'matrix note' }) },
  assignJob: { name: 'PATCH /api/jobs/:id (assign)', run: (a) => a.patch(`/api/jobs/${toAssignJobId}`).send({ assignedInstallerId: org.installer.id }) },
  jobEvents: { name: 'GET /api/jobs/:assigned/events', run: (a) => a.get(`/api/jobs/${assignedJobId}/events`) },
  addSpace: { name: 'POST /api/jobs/:id/spaces', run: (a) => a.post(`/api/jobs/${assignedJobId}/spaces`).send({ name: 'Garage loft' }) },
  getSpace: { name: 'GET /api/spaces/:id', run: (a) => a.get(`/api/spaces/${assignedSpaceId}`) },
  patchSpace: { name: 'PATCH /api/spaces/:id', run: (a) => a.patch(`/api/spaces/${assignedSpaceId}`).send({ name: 'Main loft' }) },
  outbox: { name: 'GET /api/dev/outbox', run: (a) => a.get('/api/dev/outbox') },
  me: { name: 'GET /api/auth/me', run: (a) => a.get('/api/auth/me') },
};

// Expected status per call: anonymous, office, estimator, installer.
const MATRIX: Array<[keyof typeof calls, number, number, number, number]> = [
  ['me', 401, 200, 200, 200],
  ['listUsers', 401, 200, 403, 403],
  ['inviteUser', 401, 201, 403, 403],
  ['listCustomers', 401, 200, 200, 403],
  ['createCustomer', 401, 201, 201, 403],
  ['listJobs', 401, 200, 200, 200],
  ['createJob', 401, 201, 201, 403],
  ['getAssignedJob', 401, 200, 200, 200],
  ['getUnassignedJob', 401, 200, 200, 404],
  ['patchJob', 401, 200, 200, 403],
  ['assignJob', 401, 200, 403, 403],
  ['jobEvents', 401, 200, 200, 200],
  ['addSpace', 401, 201, 201, 403],
  ['getSpace', 401, 200, 200, 200],
  ['patchSpace', 401, 200, 200, 403],
  ['outbox', 401, 200, 403, 403],
];

describe('role × route matrix', () => {
  const rows = MATRIX.flatMap(([call, anon, office, estimator, installer]) => [
    { call, who: 'anonymous' as const, expected: anon },
    { call, who: 'office' as const, expected: office },
    { call, who: 'estimator' as const, expected: estimator },
    { call, who: 'installer' as const, expected: installer },
  ]);

  it.each(rows)('$who on $call → $expected', async ({ call, who, expected }) => {
    const agent = who === 'anonymous' ? request(ctx.app) : agents[who]!;
    const res = await calls[call].run(agent);
    expect(res.status, `${calls[call].name} as ${who}: ${JSON.stringify(res.body)}`).toBe(expected);
    if (expected >= 400) {
      expect(res.headers['content-type']).toMatch(/json/);
      expect(res.body.error).toMatchObject({ code: expect.any(String), message: expect.any(String) });
    }
  });
});

describe('installers', () => {
  it('list only the jobs assigned to them', async () => {
    const res = await agents.installer!.get('/api/jobs');
    expect(res.status).toBe(200);
    const ids = res.body.jobs.map((j: { id: string }) => j.id);
    expect(ids).toContain(assignedJobId);
    expect(ids).not.toContain(unassignedJobId);
    expect(ids).toContain(toAssignJobId); // assigned by the office in the matrix above
    for (const j of res.body.jobs) expect(j.assignedInstaller?.id).toBe(org.installer.id);
  });

  it('never receive a price-like field in job responses', async () => {
    const priceKey = /(price|cost|total|minor|amount|vat|margin)/i;
    const keysOf = (v: unknown): string[] => (v && typeof v === 'object' ? Object.entries(v).flatMap(([k, x]) => [k, ...keysOf(x)]) : []);
    for (const res of [await agents.installer!.get('/api/jobs'), await agents.installer!.get(`/api/jobs/${assignedJobId}`)]) {
      expect(res.status).toBe(200);
      expect(keysOf(res.body).filter((k) => priceKey.test(k))).toEqual([]);
    }
  });
});
