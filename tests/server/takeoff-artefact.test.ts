// The takeoff artefact stored with every plan revision, however it is written, and read by the job sheet, the van load and the schedule.
import fs from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { EXTRA_KIND_LABELS } from '../../shared/api/settings';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { buildQuoteLines } from '../../shared/quote/build-lines';
import { spaceForQuote } from '../../shared/quote/from-takeoff';
import { readStoredTakeoff } from '../../shared/takeoff/takeoff-schema';
import { TAKEOFF_FORMAT } from '../../shared/takeoff/takeoff-types';
import { Organisation, PlanRevision, Space, User } from '../../server/db/models';
import { DEMO_COMPANY, DEMO_PASSWORD, seedDemo } from '../../server/db/seeders/demo';
import { loadCatalogue } from '../../server/modules/catalogue/catalogue.service';
import { backfillStoredTakeoffs, companyTakeoffInputs, computePlanTakeoff } from '../../server/modules/plan-revisions/plan-takeoff';
import { loadCompanySettings, seedDemoCatalogue, toSettingsDto } from '../../server/modules/settings/settings.service';
import { createJob, createOrgWithUsers, createTestContext, loginAs, type TestContext, type TestOrg } from '../helpers/test-app';

const examples = path.join(__dirname, '..', '..', 'examples');
const example = (name: string): Plan => planSchema.parse(JSON.parse(fs.readFileSync(path.join(examples, name), 'utf8')));

let ctx: TestContext;
let org: TestOrg;

beforeAll(async () => {
  ctx = await createTestContext();
  org = await createOrgWithUsers(ctx);
  await seedDemoCatalogue(org.id);
});
afterAll(async () => ctx?.close());

describe('the demo data', () => {
  it('gives the installer strips on the job sheet of every demo job on a fresh start', async () => {
    await seedDemo(ctx.deps); // another file may have seeded this database already: both are fine
    const demo = (await Organisation.findOne({ where: { name: DEMO_COMPANY } }))!;
    const installers = await User.findAll({ where: { organisationId: demo.id, role: 'installer' } });
    let sheets = 0;
    for (const installer of installers) {
      const agent = await loginAs(ctx.app, { email: installer.email, password: DEMO_PASSWORD });
      const jobs = (await agent.get('/api/my-jobs')).body.jobs as { id: string }[];
      for (const j of jobs) {
        const sheet = (await agent.get(`/api/jobs/${j.id}/job-sheet`)).body.sheet;
        for (const s of sheet.spaces) {
          expect(s.problem, `${s.name}`).toBeNull();
          expect(s.layers.reduce((n: number, l: { strips: unknown[] }) => n + l.strips.length, 0)).toBeGreaterThan(0);
          expect(s.netAreaM2).toBeGreaterThan(0);
        }
        expect(sheet.vanLoad.rolls.length).toBeGreaterThan(0);
        sheets++;
      }
    }
    expect(sheets).toBeGreaterThan(0);
  });
});

describe('every writer stores the takeoff', () => {
  it('stores one with a space created with a plan (POST /api/jobs/:id/spaces), computed from the company catalogue', async () => {
    const { job } = await createJob(org);
    const agent = await loginAs(ctx.app, org.estimator);
    const res = await agent.post(`/api/jobs/${job.id}/spaces`).send({ name: 'Garage loft', plan: example('rectangle.json') });
    expect(res.status).toBe(201);
    const row = await PlanRevision.findOne({ where: { spaceId: res.body.space.id } });
    const stored = readStoredTakeoff(row?.takeoff);
    expect(stored).not.toBeNull();
    const expected = computePlanTakeoff(example('rectangle.json'), await companyTakeoffInputs(org.id));
    expect(stored!.layers.map((l) => [l.productId, l.rollsByPacking])).toEqual(expected.layers.map((l) => [l.productId, l.rollsByPacking]));
    expect(stored!.layers.length).toBeGreaterThan(0);
  });

  it('backfills revisions stored without a takeoff or with the old format, and leaves current ones alone', async () => {
    const { space: a } = await createJob(org, { plan: example('l-shape.json') });
    const { space: b } = await createJob(org, { plan: example('rectangle.json') });
    const { space: c } = await createJob(org, { plan: example('tank-hatch-downlights.json') });
    await PlanRevision.update({ takeoff: null }, { where: { spaceId: a.id } });
    const old = (await PlanRevision.findOne({ where: { spaceId: b.id } }))!;
    await PlanRevision.update({ takeoff: { ...(old.takeoff as object), format: 'quiltline-takeoff/1' } }, { where: { spaceId: b.id } });
    const current = (await PlanRevision.findOne({ where: { spaceId: c.id } }))!.takeoff;

    // Counted by the schema, not the format: another test may leave a plan that cannot be worked out.
    const stale = async () => (await PlanRevision.findAll({ attributes: ['id', 'takeoff'] })).filter((r) => !readStoredTakeoff(r.takeoff)).length;
    const before = await stale();
    // Two servers starting at once: the conditional UPDATE lets each stale row be written once.
    const [r1, r2] = await Promise.all([backfillStoredTakeoffs(), backfillStoredTakeoffs()]);
    expect(r1.updated + r2.updated).toBe(before - (await stale()));
    expect(r1.updated + r2.updated).toBeGreaterThanOrEqual(2);
    for (const id of [a.id, b.id]) expect(readStoredTakeoff((await PlanRevision.findOne({ where: { spaceId: id } }))!.takeoff)?.format).toBe(TAKEOFF_FORMAT);
    expect((await PlanRevision.findOne({ where: { spaceId: c.id } }))!.takeoff).toEqual(current);
    // Nothing left to do on a second run (a plan that cannot be worked out stays as it is, counted as failed).
    expect((await backfillStoredTakeoffs()).updated).toBe(0);
  });
});

describe('readers of the stored artefact', () => {
  it('counts the van load extras by the same rule and settings as the quote', async () => {
    const plan = example('tank-hatch-downlights.json');
    const { job, space } = await createJob(org, { stage: 'scheduled', assignedInstallerId: org.installer.id, plan });
    // A company that differs from the common-practice defaults: two boards per tank, 5 m lagging, no eaves trays.
    const settingsRow = await loadCompanySettings(org.id);
    await settingsRow.update({
      extraRules: { pipeLaggingMPerTank: 5, walkwayBoardsPerTank: 2, boardLegsPerM2: 4, disposalPerJob: 1, eavesTrays: false },
    } as never);
    const installer = await loginAs(ctx.app, org.installer);
    const sheet = (await installer.get(`/api/jobs/${job.id}/job-sheet`)).body.sheet;

    const catalogue = await loadCatalogue(org.id);
    const stored = readStoredTakeoff((await PlanRevision.findOne({ where: { spaceId: space.id } }))!.takeoff)!;
    const built = buildQuoteLines([spaceForQuote(space.name, stored)], catalogue, toSettingsDto(await loadCompanySettings(org.id)));
    const quoteExtras = built.lines.filter((l) => l.kind === 'extra').map((l) => [l.description, l.quantity]);
    expect(quoteExtras.length).toBeGreaterThan(2);
    expect(sheet.vanLoad.extras.map((e: { label: string; quantity: number }) => [e.label, e.quantity])).toEqual(quoteExtras);
    const tanks = stored.exclusions.countsByKind.tank;
    expect(tanks).toBeGreaterThan(0);
    const boards = sheet.vanLoad.extras.find((e: { label: string }) => /walkway/i.test(e.label));
    expect(boards.quantity).toBe(tanks * 2);
    expect(sheet.vanLoad.extras.some((e: { label: string }) => e.label === EXTRA_KIND_LABELS.eaves_tray || /eaves/i.test(e.label))).toBe(false);
  });

  it("counts the stored takeoff's m² in the schedule's capacity check", async () => {
    const { job } = await createJob(org, { stage: 'accepted', plan: example('rectangle.json') });
    const office = await loginAs(ctx.app, org.office);
    const net = readStoredTakeoff(
      (await PlanRevision.findOne({ where: { spaceId: (await Space.findOne({ where: { jobId: job.id } }))!.id } }))!.takeoff,
    )!.netAreaM2;
    expect(net).toBeGreaterThan(40);
    const row = (await office.get('/api/schedule')).body;
    const listed = [...(row.unscheduled ?? []), ...(row.jobs ?? [])].find((j: { id: string }) => j.id === job.id);
    expect(listed?.areaM2).toBe(net);
  });
});
