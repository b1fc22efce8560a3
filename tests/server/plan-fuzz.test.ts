import fs from 'node:fs';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import path from 'node:path';
import fc from 'fast-check';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { PlanRevision, Space } from '../../server/db/models';
import { PLAN_LIMITS } from '../../shared/plan/plan-limits';
import { createJob, createOrgWithUsers, createTestContext, TEST_PASSWORD, type TestContext, type TestOrg } from '../helpers/test-app';

// 10,000 random and malformed plans against the API. Each must be answered with 2xx or 4xx within
// a bounded time, and a 4xx must write nothing (revisions and spaces counted after the run).
const RUNS = 10_000;
const TIME_LIMIT_MS = 3_000;
let ctx: TestContext;
let org: TestOrg;
let server: Server;
let base: string;
let cookie: string;

const example = JSON.parse(fs.readFileSync(path.join(__dirname, '../../examples/rectangle.json'), 'utf8'));

beforeAll(async () => {
  ctx = await createTestContext({ TAKEOFF_TIME_LIMIT_MS: String(TIME_LIMIT_MS) });
  org = await createOrgWithUsers(ctx);
  server = ctx.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  const res = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: org.estimator.email, password: TEST_PASSWORD }),
  });
  cookie = res.headers
    .getSetCookie()
    .map((c) => c.split(';')[0])
    .join('; ');
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise((r) => server.close(r));
  await ctx.close();
});

const num = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true }),
  fc.integer({ min: -20_000, max: 20_000 }),
  fc.constantFrom(0, -1, 1e-9, 0.4, 1e308, -1e308, 2 ** 53),
);
const junk = fc.oneof(fc.string({ maxLength: 8 }), fc.boolean(), fc.constant(null), fc.array(fc.integer(), { maxLength: 3 }), fc.object({ maxDepth: 1 }));
const point = fc.oneof({ weight: 8, arbitrary: fc.tuple(num, num) }, { weight: 1, arbitrary: junk }, { weight: 1, arbitrary: fc.array(num, { maxLength: 4 }) });
// Long arrays are one repeated value: cheap to make and to send, and over the limits.
const huge = <T>(v: fc.Arbitrary<T>, limit: number) => fc.tuple(v, fc.integer({ min: limit + 1, max: limit * 4 })).map(([x, n]) => Array(n).fill(x));
const outline = fc.oneof(
  { weight: 6, arbitrary: fc.array(point, { maxLength: 10 }) },
  { weight: 1, arbitrary: huge(point, PLAN_LIMITS.outlineCorners) },
  { weight: 1, arbitrary: junk },
);
const exclusion = fc.record(
  {
    kind: fc.oneof(fc.constantFrom('hatch', 'tank', 'chimney', 'flue', 'boarded', 'downlight', 'other'), fc.string({ maxLength: 6 })),
    polygon: fc.oneof(fc.array(point, { maxLength: 6 }), huge(point, PLAN_LIMITS.exclusionCorners)),
    at: point,
    clearanceMm: num,
  },
  { requiredKeys: ['kind'] },
);
const joists = fc.record(
  { angleDeg: num, centresMm: fc.oneof(num, fc.constantFrom(0.4, 400, 600)), widthMm: fc.oneof(num, fc.constant(47)), depthMm: num, offsetMm: num },
  { requiredKeys: [] },
);
// A plan-shaped object with any field replaced, dropped or of the wrong type.
const planLike = fc.record(
  {
    format: fc.oneof({ weight: 9, arbitrary: fc.constant('quiltline-plan/1') }, { weight: 1, arbitrary: junk }),
    name: fc.oneof(fc.string({ maxLength: 20 }), junk),
    outline,
    eavesEdges: fc.oneof(fc.array(fc.integer({ min: -2, max: 12 }), { maxLength: 4 }), huge(fc.constant(0), PLAN_LIMITS.outlineCorners)),
    eavesGapMm: num,
    joists: fc.oneof({ weight: 4, arbitrary: joists }, { weight: 1, arbitrary: junk }),
    exclusions: fc.oneof(
      { weight: 6, arbitrary: fc.array(exclusion, { maxLength: 5 }) },
      { weight: 1, arbitrary: huge(fc.constant({ kind: 'downlight', at: [10, 10] }), PLAN_LIMITS.exclusions) },
    ),
    existing: fc.oneof(fc.record({ depthMm: num, condition: fc.string({ maxLength: 8 }) }), junk),
    target: fc.oneof(fc.record({ depthMm: num }), fc.record({ uValue: num }), junk),
  },
  { requiredKeys: ['format'] },
);
// The example with one field broken: mostly near-valid plans, some of which are saved.
const mutated = fc.tuple(fc.constantFrom(...Object.keys(example)), fc.oneof(num, junk, outline, joists), fc.boolean()).map(([key, value, drop]) => {
  const p = structuredClone(example);
  if (drop) delete p[key];
  else p[key] = value;
  return p;
});
// Weighted towards refusals: a saved plan costs a takeoff and a database write, a refused one little.
const anyPlan = fc.oneof({ weight: 12, arbitrary: planLike }, { weight: 2, arbitrary: mutated }, { weight: 2, arbitrary: fc.anything() });

it(`answers ${RUNS.toLocaleString('en-GB')} random and malformed plans with 2xx/4xx in bounded time, writing nothing for a 4xx`, async () => {
  const plans = fc.sample(anyPlan, { numRuns: RUNS, seed: 13 });
  const { job } = await createJob(org);
  const lanes = 8;
  const spaces = await Promise.all(Array.from({ length: lanes }, () => createJob(org).then((j) => j.space)));
  const spacesBefore = await Space.count({ where: { jobId: job.id } });
  const saved = new Map<string, number>(spaces.map((s) => [s.id, 0]));
  let created = 0;
  let slowest = 0;
  const statuses = new Map<number, number>();
  const send = async (i: number, spaceId: string) => {
    const revision = saved.get(spaceId)!;
    // One in ten goes to POST /api/jobs/:id/spaces (a new space with a first plan), the rest to PUT.
    const toSpaces = i % 10 === 0;
    const started = performance.now();
    const res = await fetch(toSpaces ? `${base}/api/jobs/${job.id}/spaces` : `${base}/api/spaces/${spaceId}/plan`, {
      method: toSpaces ? 'POST' : 'PUT',
      headers: { 'content-type': 'application/json', cookie },
      body: JSON.stringify(toSpaces ? { name: `Fuzz ${i}`, plan: plans[i] } : { plan: plans[i], baseRevision: revision }),
      signal: AbortSignal.timeout(TIME_LIMIT_MS * 4),
    });
    await res.arrayBuffer();
    slowest = Math.max(slowest, performance.now() - started);
    statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
    if (res.status >= 500 || res.status < 200 || (res.status >= 300 && res.status < 400)) {
      throw new Error(`plan ${i} got ${res.status}: ${JSON.stringify(plans[i]).slice(0, 300)}`);
    }
    if (res.status < 300) {
      if (toSpaces) created++;
      else saved.set(spaceId, revision + 1);
    }
  };
  // Eight lanes, one space each, requests in order within a lane (so baseRevision is always current).
  await Promise.all(
    spaces.map(async (space, lane) => {
      for (let i = lane; i < RUNS; i += lanes) await send(i, space.id);
    }),
  );
  for (const space of spaces) expect(await PlanRevision.count({ where: { spaceId: space.id } })).toBe(saved.get(space.id));
  expect(await Space.count({ where: { jobId: job.id } })).toBe(spacesBefore + created);
  const fourxx = [...statuses].filter(([s]) => s >= 400).reduce((a, [, n]) => a + n, 0);
  // Most plans are refused, some saved: both paths were exercised.
  expect(fourxx).toBeGreaterThan(RUNS / 2);
  expect(RUNS - fourxx).toBeGreaterThan(50);
  expect(slowest).toBeLessThan(TIME_LIMIT_MS * 3);
  console.log(`plan fuzz: ${JSON.stringify(Object.fromEntries(statuses))}, slowest answer ${Math.round(slowest)} ms`);
}, 1_200_000);
