/**
 * Takeoff benchmark (a script that prints numbers, not a test):
 *   npm run bench [-- --runs N]
 * Median and 90th-percentile wall time of a full `computeTakeoff` (geometry checks included)
 * for every valid example plan and for a generated stress plan (400-point outline, 100
 * exclusions, about 600 m², 400 mm centres), plus `validatePlan` on the stress plan. CPU time per
 * run (process.cpuUsage over the batch) is printed beside the wall time because a busy machine
 * stretches wall time. The stress plan is also run with joists at 0°, 17°, 33° and 45° (skewed
 * joists cut more sub-slabs and more slivers). Goals: under 1 ms for a typical plan, under 10 ms
 * for the stress plan, and a skewed stress plan no more than 1.5× the same plan at 0°.
 */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { loadavg } from 'node:os';
import { fileURLToPath } from 'node:url';
import { dirname, join, relative } from 'node:path';
import { validatePlan } from '../shared/plan/validate-plan';
import { computeTakeoff } from '../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../shared/takeoff/products';
import type { Plan } from '../shared/plan/plan-schema';
import { stressPlan } from './stress-plan';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const examples = join(root, 'examples');
const runsArg = process.argv.indexOf('--runs');
const RUNS = runsArg > 0 ? Number(process.argv[runsArg + 1]) : 200;

function listJson(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? listJson(p) : name.endsWith('.json') ? [p] : [];
  });
}

function quantile(sorted: number[], q: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];
}

function measure(fn: () => unknown, runs: number, warmup: number): { median: number; p90: number; cpu: number } {
  for (let i = 0; i < warmup; i++) fn();
  const times: number[] = [];
  const c0 = process.cpuUsage();
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    fn();
    times.push(performance.now() - t0);
  }
  const c = process.cpuUsage(c0);
  times.sort((a, b) => a - b);
  return { median: quantile(times, 0.5), p90: quantile(times, 0.9), cpu: (c.user + c.system) / 1000 / runs };
}

const products = parseProductCatalogue(JSON.parse(readFileSync(join(examples, 'products.json'), 'utf8')));
const rows: { name: string; detail: string; r: ReturnType<typeof measure> }[] = [];
for (const file of listJson(examples).sort()) {
  if (file.endsWith('products.json')) continue;
  const v = validatePlan(JSON.parse(readFileSync(file, 'utf8')));
  if (!v.ok) continue;
  const plan: Plan = v.plan;
  const t = computeTakeoff(plan, { products });
  const strips = t.layers.reduce((n, l) => n + l.strips.length, 0);
  rows.push({
    name: relative(examples, file),
    detail: `${plan.outline.length} pts, ${plan.exclusions.length} excl, ${t.grossAreaM2.toFixed(0)} m², ${strips} strips`,
    r: measure(() => computeTakeoff(plan, { products }), RUNS, 50),
  });
}
const stressInput = stressPlan();
const sv = validatePlan(stressInput);
if (!sv.ok) throw new Error(`stress plan invalid: ${sv.errors[0].message}`);
const st = computeTakeoff(sv.plan, { products });
const stressRuns = Math.max(10, Math.round(RUNS / 5));
rows.push({
  name: 'stress (generated)',
  detail: `${sv.plan.outline.length} pts, ${sv.plan.exclusions.length} excl, ${st.grossAreaM2.toFixed(0)} m², ${st.layers.reduce((n, l) => n + l.strips.length, 0)} strips`,
  r: measure(() => computeTakeoff(sv.plan, { products }), stressRuns, 10),
});
// The same stress plan with square and skewed joists: skew costs the band clipping more sub-slabs.
const SKEWS = [17, 33, 45];
for (const deg of [0, ...SKEWS]) {
  const v = validatePlan(stressPlan(7, 400, 100, deg));
  if (!v.ok) throw new Error(`stress plan at ${deg}° invalid: ${v.errors[0].message}`);
  rows.push({ name: `stress joists ${deg}°`, detail: 'same plan, joists turned', r: measure(() => computeTakeoff(v.plan, { products }), stressRuns, 10) });
}
rows.push({ name: 'stress validatePlan', detail: 'zod parse + geometry checks', r: measure(() => validatePlan(stressInput), stressRuns, 10) });

const typical = rows
  .filter((x) => !x.name.startsWith('stress'))
  .map((x) => x.r.median)
  .sort((a, b) => a - b);
console.log(
  `takeoff benchmark — node ${process.version}, load average ${loadavg()
    .map((x) => x.toFixed(1))
    .join(' ')}, ${RUNS} runs per example, ${stressRuns} for the stress plan`,
);
console.log(`${'plan'.padEnd(34)}${'median ms'.padStart(10)}${'p90 ms'.padStart(9)}${'cpu ms'.padStart(9)}  detail`);
for (const { name, detail, r } of rows) {
  console.log(`${name.padEnd(34)}${r.median.toFixed(3).padStart(10)}${r.p90.toFixed(3).padStart(9)}${r.cpu.toFixed(3).padStart(9)}  ${detail}`);
}
const stress = rows.find((x) => x.name === 'stress (generated)')!.r;
const at0 = rows.find((x) => x.name === 'stress joists 0°')!.r.median;
for (const deg of SKEWS) {
  const at = rows.find((x) => x.name === `stress joists ${deg}°`)!.r.median;
  console.log(`stress at ${deg}° / at 0°: ${(at / at0).toFixed(2)} (goal ≤ 1.5)`);
}
console.log(`typical plan median ${quantile(typical, 0.5).toFixed(3)} ms (goal < 1 ms); stress median ${stress.median.toFixed(2)} ms (goal < 10 ms)`);
