import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { Job } from '../../server/db/models';
import { JOB_SORTS } from '../../shared/api/jobs';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

// GET /api/jobs pages by cursor (it returned every job, up to 500, at once).
let ctx: TestContext;
let org: TestOrg;
type Agent = Awaited<ReturnType<typeof loginAs>>;
let office: Agent;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  const names = ['Ada North', 'Ben East', 'Cy South', 'Di West', 'Ed North', 'Flo East', 'Gus South'];
  for (const [i, customerName] of names.entries()) {
    const { job } = await createJob(org, { customerName, stage: i % 2 ? 'quoted' : 'enquiry' });
    // Two jobs share an install date and two share an update time, so ties need the id to order them.
    await Job.update({ installDate: i < 4 ? `2027-0${1 + (i % 2)}-10` : null, updatedAt: new Date(Date.UTC(2026, 10, 1 + Math.min(i, 5))) } as never, {
      where: { id: job.id },
      silent: true,
    });
  }
  office = await loginAs(ctx.app, org.office);
});
afterAll(async () => ctx.close());

async function allPages(query: Record<string, string | number>) {
  const ids: string[] = [];
  let cursor: string | undefined;
  let pages = 0;
  do {
    const res = await office.get('/api/jobs').query({ ...query, limit: 3, ...(cursor ? { cursor } : {}) });
    expect(res.status).toBe(200);
    expect(res.body.jobs.length).toBeLessThanOrEqual(3);
    ids.push(...res.body.jobs.map((j: { id: string }) => j.id));
    cursor = res.body.nextCursor ?? undefined;
    pages++;
  } while (cursor && pages < 10);
  return { ids, pages };
}

describe('GET /api/jobs paging', () => {
  it.each(JOB_SORTS.flatMap((sort) => (['asc', 'desc'] as const).map((dir) => ({ sort, dir }))))(
    'pages of 3 by $sort $dir add up to the whole list, in its order, each job once',
    async ({ sort, dir }) => {
      const whole = await office.get('/api/jobs').query({ sort, dir, limit: 100 });
      expect(whole.body.count).toBe(7);
      expect(whole.body.nextCursor).toBeNull();
      const { ids, pages } = await allPages({ sort, dir });
      expect(pages).toBe(3);
      expect(ids).toEqual(whole.body.jobs.map((j: { id: string }) => j.id));
      expect(new Set(ids).size).toBe(7);
    },
  );

  it('keeps pages apart when a job is added between them (keyset, not offset)', async () => {
    const first = await office.get('/api/jobs').query({ sort: 'created', dir: 'asc', limit: 3 });
    await createJob(org, { customerName: 'Hal Late' });
    const second = await office.get('/api/jobs').query({ sort: 'created', dir: 'asc', limit: 3, cursor: first.body.nextCursor });
    const a = first.body.jobs.map((j: { id: string }) => j.id);
    const b = second.body.jobs.map((j: { id: string }) => j.id);
    expect(a.filter((id: string) => b.includes(id))).toEqual([]);
  });

  it('searches across pages: total counts the matches, pages hold only matches', async () => {
    const res = await office.get('/api/jobs').query({ q: 'north', limit: 1 });
    expect(res.body.count).toBe(2);
    expect(res.body.jobs).toHaveLength(1);
    const next = await office.get('/api/jobs').query({ q: 'north', limit: 1, cursor: res.body.nextCursor });
    expect(next.body.jobs[0].customer.name).toMatch(/North/);
    expect(next.body.jobs[0].id).not.toBe(res.body.jobs[0].id);
  });

  it('refuses a cursor it did not give out, or one from another order, naming the field', async () => {
    const bad = await office.get('/api/jobs').query({ cursor: 'not-a-cursor' });
    expect(bad.status).toBe(422);
    expect(bad.body.error.details[0].path).toBe('cursor');
    const page = await office.get('/api/jobs').query({ sort: 'customer', limit: 2 });
    const mixed = await office.get('/api/jobs').query({ sort: 'updated', cursor: page.body.nextCursor });
    expect(mixed.status).toBe(422);
    expect(mixed.body.error.message).toMatch(/another order/);
    expect((await office.get('/api/jobs').query({ limit: 1000 })).status).toBe(422);
  });
});
