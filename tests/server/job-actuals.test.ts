import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { CompanySetting, Job, JobActual, JobEvent } from '../../server/db/models';
import { createOrgWithUsers, createTestContext, createUser, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';
import { readyToFinish } from './job-sheet-fixtures';
import { missingActuals } from '../../server/modules/actuals/record-actuals';

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
});
afterAll(async () => {
  await ctx?.close();
});

/** A scheduled job with every check ticked and an after photo: ready to finish. */
const readyJob = (agent: Awaited<ReturnType<typeof loginAs>>) => readyToFinish(org, agent);

function actualsFor(productIds: string[], userId: string) {
  return {
    rolls: productIds.map((productId, i) => ({ productId, used: 5 + i, returned: 1 })),
    hours: [{ userId, hours: 6.5 }],
    extras: [{ code: 'hatch_kit', used: 1 }],
  };
}

describe('actuals on POST /api/jobs/:id/finish', () => {
  it('stores the actuals once when the same finish (same Idempotency-Key) is sent twice, and answers both as done', async () => {
    const agent = await loginAs(ctx.app, org.installer);
    const { job, productIds } = await readyJob(agent);
    const body = { actuals: actualsFor(productIds, org.installer.id) };
    const first = await agent.post(`/api/jobs/${job.id}/finish`).set('Idempotency-Key', 'finish-key-0001').send(body);
    expect(first.status).toBe(200);
    expect(first.body.replayed).toBe(false);
    const again = await agent.post(`/api/jobs/${job.id}/finish`).set('Idempotency-Key', 'finish-key-0001').send(body);
    expect(again.status).toBe(200);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(await JobActual.count({ where: { jobId: job.id } })).toBe(1);
    expect(await JobEvent.count({ where: { jobId: job.id, kind: 'installed' } })).toBe(1);
    const row = await JobActual.findByPk(job.id);
    expect(row?.rolls).toEqual(body.actuals.rolls);
    expect(row?.hours).toEqual(body.actuals.hours);
    expect(row?.extras).toEqual(body.actuals.extras);
  });

  it('stores them once when two sends of the same finish race', async () => {
    const agent = await loginAs(ctx.app, org.installer);
    const { job, productIds } = await readyJob(agent);
    const body = { actuals: actualsFor(productIds, org.installer.id) };
    const [a, b] = await Promise.all([
      agent.post(`/api/jobs/${job.id}/finish`).set('Idempotency-Key', 'finish-race-0001').send(body),
      agent.post(`/api/jobs/${job.id}/finish`).set('Idempotency-Key', 'finish-race-0001').send(body),
    ]);
    expect([a.status, b.status]).toEqual([200, 200]);
    expect([a.body.replayed, b.body.replayed].sort()).toEqual([false, true]);
    expect(await JobActual.count({ where: { jobId: job.id } })).toBe(1);
  });

  it('refuses a second finish with another key as already installed and keeps the first actuals', async () => {
    const agent = await loginAs(ctx.app, org.installer);
    const { job, productIds } = await readyJob(agent);
    await agent
      .post(`/api/jobs/${job.id}/finish`)
      .set('Idempotency-Key', 'finish-once-0001')
      .send({ actuals: actualsFor(productIds, org.installer.id) });
    const other = await agent
      .post(`/api/jobs/${job.id}/finish`)
      .set('Idempotency-Key', 'finish-once-0002')
      .send({ actuals: { rolls: [{ productId: productIds[0], used: 99 }] } });
    expect(other.status).toBe(409);
    expect(other.body.error.code).toBe('job_installed');
    expect((await JobActual.findByPk(job.id))?.rolls[0].used).toBe(5);
  });

  it('finishes without actuals when the company asks for none, storing no row', async () => {
    const agent = await loginAs(ctx.app, org.installer);
    const { job } = await readyJob(agent);
    expect((await agent.post(`/api/jobs/${job.id}/finish`).send({})).status).toBe(200);
    expect(await JobActual.count({ where: { jobId: job.id } })).toBe(0);
  });

  it('names a product not on the job, a person not in the company and a bad count, and changes nothing', async () => {
    const agent = await loginAs(ctx.app, org.installer);
    const { job, productIds } = await readyJob(agent);
    const stranger = await createUser((await createOrgWithUsers()).id, 'installer');
    const cases: [unknown, string][] = [
      [{ rolls: [{ productId: 'no-such-product', used: 3 }] }, 'actuals.rolls.0.productId'],
      [{ hours: [{ userId: stranger.id, hours: 3 }] }, 'actuals.hours.0.userId'],
      [{ rolls: [{ productId: productIds[0], used: -1 }] }, 'actuals.rolls.0.used'],
      [
        {
          rolls: [
            { productId: productIds[0], used: 1 },
            { productId: productIds[0], used: 2 },
          ],
        },
        'actuals.rolls.1',
      ],
    ];
    for (const [actuals, path] of cases) {
      const res = await agent.post(`/api/jobs/${job.id}/finish`).send({ actuals });
      expect(res.status, path).toBe(422);
      expect(res.body.error.details.map((d: { path: string }) => d.path)).toContain(path);
    }
    expect((await Job.findByPk(job.id))?.stage).toBe('scheduled');
    expect(await JobActual.count({ where: { jobId: job.id } })).toBe(0);
  });

  it('asks for what the company requires before marking installed, and tells the sheet what that is', async () => {
    const own = await createOrgWithUsers();
    await CompanySetting.update({ actualsRequired: ['hours', 'extras'] }, { where: { organisationId: own.id } });
    const saved = org;
    org = own;
    try {
      const agent = await loginAs(ctx.app, own.installer);
      const { job, productIds } = await readyJob(agent);
      const sheet = (await agent.get(`/api/jobs/${job.id}/job-sheet`)).body.sheet;
      expect(sheet.actualsRequired).toEqual(['hours', 'extras']);
      expect(sheet.vanLoad.extras.length).toBeGreaterThan(0);
      const res = await agent.post(`/api/jobs/${job.id}/finish`).send({ actuals: { rolls: [{ productId: productIds[0], used: 4 }] } });
      expect(res.status).toBe(409);
      expect(res.body.error.details.map((d: { path: string }) => d.path)).toEqual(['actuals.hours', 'actuals.extras']);
      expect(res.body.error.message).toMatch(/record the hours on site/);
      const noExtras = await agent.post(`/api/jobs/${job.id}/finish`).send({ actuals: { hours: [{ userId: own.installer.id, hours: 4 }] } });
      expect(noExtras.body.error.details.map((d: { path: string }) => d.path)).toEqual(['actuals.extras']);
      expect((await Job.findByPk(job.id))?.stage).toBe('scheduled');
      const ok = await agent
        .post(`/api/jobs/${job.id}/finish`)
        .send({ actuals: { hours: [{ userId: own.installer.id, hours: 4 }], extras: [{ code: 'hatch_kit', used: 1 }] } });
      expect(ok.status).toBe(200);
    } finally {
      org = saved;
    }
  });

  it('does not ask for a part the job has nothing for (no extras in the van load)', () => {
    const applies = { rolls: true, hours: true, extras: false };
    expect(missingActuals(undefined, ['extras'], applies)).toEqual([]);
    expect(missingActuals(undefined, ['extras', 'hours'], applies).map((d) => d.path)).toEqual(['actuals.hours']);
  });
});
