/**
 * Takeoff benchmark (a script that prints numbers, not a test):
 *   npm run bench [-- --runs N] [--base DIR]
 * Median and 90th-percentile wall time of a full `computeTakeoff` (geometry checks included)
 * for every valid example plan and for a generated stress plan (400-point outline, 100
 * exclusions, about 600 m², 400 mm centres), plus `validatePlan` on the stress plan. CPU time per
 * run (process.cpuUsage over the batch) is printed beside the wall time because a busy machine
 * stretches wall time. The stress plan is also run with joists at 0°, 17°, 33° and 45° (skewed
 * joists cut more sub-slabs and more slivers). Goals: under 1 ms for a typical plan, under 10 ms
 * for the stress plan, and a skewed stress plan no more than 1.5× the same plan at 0°.
 * With `--base DIR` (an older tree whose packages resolve, as for takeoff-compare.ts) every plan
 * is also run with DIR's computeTakeoff, turn about with this tree's in the same process, and
 * the ratio of the medians is printed: a busy machine slows both alike.
 */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { loadavg } from 'node:os';
import { fileURLToPath } from 'node:url';
import { dirname, join, relative, resolve } from 'node:path';
import { validatePlan } from '../shared/plan/validate-plan';
import { computeTakeoff } from '../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../shared/takeoff/products';
import type { Plan } from '../shared/plan/plan-schema';
import { stressPlan } from './stress-plan';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const examples = join(root, 'examples');
const arg = (name: string) => (process.argv.includes(name) ? process.argv[process.argv.indexOf(name) + 1] : undefined);
const RUNS = Number(arg('--runs') ?? 200);
const baseDir = arg('--base');
const catalogue: unknown = JSON.parse(readFileSync(join(examples, 'products.json'), 'utf8'));
const base = baseDir
  ? {
      computeTakeoff: ((await import(resolve(baseDir, 'shared/takeoff/compute-takeoff.ts'))) as { computeTakeoff: typeof computeTakeoff }).computeTakeoff,
      products: (
        (await import(resolve(baseDir, 'shared/takeoff/products.ts'))) as { parseProductCatalogue: typeof parseProductCatalogue }
      ).parseProductCatalogue(catalogue),
    }
  : undefined;

function listJson(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name);
    return statSync(p).isDirectory() ? listJson(p) : name.endsWith('.json') ? [p] : [];
  });
}

function quantile(sorted: number[], q: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(q * sorted.length))];
}

type Timing = { median: number; p90: number; cpu: number };

/** Times `fns` turn about (the order swapped every run, so neither always goes first): wall time per run and CPU time per run. */
function measureAll(fns: (() => unknown)[], runs: number, warmup: number): Timing[] {
  for (let i = 0; i < warmup; i++) for (const fn of fns) fn();
  const times = fns.map(() => [] as number[]);
  const cpu = fns.map(() => 0);
  for (let i = 0; i < runs; i++) {
    for (let j = 0; j < fns.length; j++) {
      const k = i % 2 ? fns.length - 1 - j : j;
      const c0 = process.cpuUsage();
      const t0 = performance.now();
      fns[k]();
      times[k].push(performance.now() - t0);
      const c = process.cpuUsage(c0);
      cpu[k] += c.user + c.system;
    }
  }
  return times.map((t, k) => {
    t.sort((a, b) => a - b);
    return { median: quantile(t, 0.5), p90: quantile(t, 0.9), cpu: cpu[k] / 1000 / runs };
  });
}

/** This tree's takeoff of `plan` (and the base tree's, with `--base`), timed. */
function measureTakeoff(plan: Plan, runs: number, warmup: number): { r: Timing; base?: Timing } {
  const fns = [() => computeTakeoff(plan, { products })];
  if (base) fns.push(() => base.computeTakeoff(plan, { products: base.products }));
  const [r, b] = measureAll(fns, runs, warmup);
  return { r, base: b };
}

const products = parseProductCatalogue(catalogue);
const rows: { name: string; detail: string; r: Timing; base?: Timing }[] = [];
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
    ...measureTakeoff(plan, RUNS, 50),
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
  ...measureTakeoff(sv.plan, stressRuns, 10),
});
// The same stress plan with square and skewed joists: skew costs the band clipping more sub-slabs.
const SKEWS = [17, 33, 45];
for (const deg of [0, ...SKEWS]) {
  const v = validatePlan(stressPlan(7, 400, 100, deg));
  if (!v.ok) throw new Error(`stress plan at ${deg}° invalid: ${v.errors[0].message}`);
  rows.push({ name: `stress joists ${deg}°`, detail: 'same plan, joists turned', ...measureTakeoff(v.plan, stressRuns, 10) });
}
rows.push({ name: 'stress validatePlan', detail: 'zod parse + geometry checks', r: measureAll([() => validatePlan(stressInput)], stressRuns, 10)[0] });

const typical = rows
  .filter((x) => !x.name.startsWith('stress'))
  .map((x) => x.r.median)
  .sort((a, b) => a - b);
console.log(
  `takeoff benchmark — node ${process.version}, load average ${loadavg()
    .map((x) => x.toFixed(1))
    .join(' ')}, ${RUNS} runs per example, ${stressRuns} for the stress plan`,
);
const baseHead = base ? `${'base ms'.padStart(9)}${'/base'.padStart(7)}` : '';
console.log(`${'plan'.padEnd(34)}${'median ms'.padStart(10)}${'p90 ms'.padStart(9)}${'cpu ms'.padStart(9)}${baseHead}  detail`);
for (const { name, detail, r, base: b } of rows) {
  const vsBase = base ? (b ? `${b.median.toFixed(3).padStart(9)}${(r.median / b.median).toFixed(2).padStart(7)}` : ' '.repeat(16)) : '';
  console.log(`${name.padEnd(34)}${r.median.toFixed(3).padStart(10)}${r.p90.toFixed(3).padStart(9)}${r.cpu.toFixed(3).padStart(9)}${vsBase}  ${detail}`);
}
if (base) console.log(`base: ${baseDir} (medians of the two trees' takeoffs run turn about)`);
const stress = rows.find((x) => x.name === 'stress (generated)')!.r;
const at0 = rows.find((x) => x.name === 'stress joists 0°')!.r.median;
for (const deg of SKEWS) {
  const at = rows.find((x) => x.name === `stress joists ${deg}°`)!.r.median;
  console.log(`stress at ${deg}° / at 0°: ${(at / at0).toFixed(2)} (goal ≤ 1.5)`);
}
console.log(`typical plan median ${quantile(typical, 0.5).toFixed(3)} ms (goal < 1 ms); stress median ${stress.median.toFixed(2)} ms (goal < 10 ms)`);
