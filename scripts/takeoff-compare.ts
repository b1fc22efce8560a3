/**
 * Takeoff sameness check (a script, for speed work on shared/): computes the takeoff JSON of the
 * examples (at their own and at turned joists), the stress plans at many angles and seeds, and
 * N random plans (outlines drawn or star-shaped, every exclusion kind, eaves, turned and moved
 * copies, some company settings) with this tree's shared/ and with an older tree's, and prints
 * the first differences:
 *   npx tsx scripts/takeoff-compare.ts --base DIR [--plans 3000]
 * DIR holds the older code where its packages resolve, e.g. `git worktree add DIR main` with
 * `ln -s "$PWD/node_modules" DIR/node_modules`. Exits 1 on any difference.
 */
import { readFileSync, readdirSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { computeTakeoff } from '../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../shared/takeoff/products';
import { validatePlan } from '../shared/plan/validate-plan';
import type { Plan, PlanInput } from '../shared/plan/plan-schema';
import type { TakeoffSettings } from '../shared/takeoff/settings';
import { mulberry32 } from './mulberry32';
import { stressPlan } from './stress-plan';

type Compute = typeof computeTakeoff;
const arg = (name: string) => (process.argv.includes(name) ? process.argv[process.argv.indexOf(name) + 1] : undefined);
const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const baseDir = arg('--base');
if (!baseDir) throw new Error('usage: npx tsx scripts/takeoff-compare.ts --base DIR [--plans N]');
const N = Number(arg('--plans') ?? 3000);
const base = (await import(resolve(baseDir, 'shared/takeoff/compute-takeoff.ts'))) as { computeTakeoff: Compute };
const baseProductsModule = (await import(resolve(baseDir, 'shared/takeoff/products.ts'))) as { parseProductCatalogue: typeof parseProductCatalogue };
const catalogue: unknown = JSON.parse(readFileSync(join(root, 'examples/products.json'), 'utf8'));
const sides: [Compute, ReturnType<typeof parseProductCatalogue>][] = [
  [computeTakeoff, parseProductCatalogue(catalogue)],
  [base.computeTakeoff, baseProductsModule.parseProductCatalogue(catalogue)],
];

// The same plans on every run.
const rand = mulberry32(12345);
const int = (lo: number, hi: number) => lo + Math.floor(rand() * (hi - lo + 1));
const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rand() * xs.length)];
type Pt = [number, number];

function starOutline(): Pt[] {
  const n = int(4, 24);
  const [cx, cy] = [int(-20000, 20000), int(-20000, 20000)];
  const minR = int(1000, 4000);
  const maxR = minR + int(500, 6000);
  const gaps = Array.from({ length: n }, () => 0.2 + rand() * 0.8);
  const total = gaps.reduce((s, g) => s + g, 0);
  let acc = 0;
  return gaps.map((g) => {
    acc += g;
    const th = (2 * Math.PI * acc) / total;
    const r = int(minR, maxR);
    return [Math.round(cx + r * Math.cos(th)), Math.round(cy + r * Math.sin(th))];
  });
}

function drawnOutline(): Pt[] {
  const [w, h] = [int(3000, 12000), int(3000, 9000)];
  const [x, y] = [Math.round(w * (0.3 + rand() * 0.4)), Math.round(h * (0.3 + rand() * 0.4))];
  const q = Math.round(x / 2);
  return pick<Pt[]>([
    [
      [0, 0],
      [w, 0],
      [w, h],
      [0, h],
    ],
    [
      [0, 0],
      [w, 0],
      [w, y],
      [x, y],
      [x, h],
      [0, h],
    ],
    [
      [0, 0],
      [w, 0],
      [w, y],
      [w - q, y],
      [w - q, h],
      [q, h],
      [q, y],
      [0, y],
    ],
  ]);
}

function turned(pts: Pt[], deg: number, dx: number, dy: number, round: boolean): Pt[] {
  const [c, s] = [Math.cos((deg * Math.PI) / 180), Math.sin((deg * Math.PI) / 180)];
  return pts.map(([x, y]) => {
    const p: Pt = [x * c - y * s + dx, x * s + y * c + dy];
    return round ? [Math.round(p[0]), Math.round(p[1])] : p;
  });
}

function randomPlan(i: number): PlanInput {
  const drawn = i % 3 === 0;
  let outline = drawn ? drawnOutline() : starOutline();
  const xs = outline.map((p) => p[0]);
  const ys = outline.map((p) => p[1]);
  const exclusions: NonNullable<PlanInput['exclusions']> = [];
  for (let k = int(0, 8); k > 0; k--) {
    const kind = pick(['hatch', 'tank', 'chimney', 'flue', 'boarded', 'downlight', 'other'] as const);
    const [x0, y0] = [int(Math.min(...xs), Math.max(...xs)), int(Math.min(...ys), Math.max(...ys))];
    if (kind === 'downlight' || (kind === 'hatch' && rand() < 0.3)) {
      exclusions.push({ kind, at: [x0, y0] });
      continue;
    }
    const [w, h, skew] = [int(150, 2000), int(150, 2000), drawn ? 0 : int(-300, 300)];
    const polygon: Pt[] = [
      [x0, y0],
      [x0 + w, y0],
      [x0 + w + skew, y0 + h],
      [x0 + skew, y0 + h],
    ];
    exclusions.push({
      kind,
      polygon,
      ...(kind === 'boarded' ? { boards: pick(['raise', 'leave'] as const) } : {}),
      ...(rand() < 0.2 ? { clearanceMm: int(0, 300) } : {}),
    });
  }
  let angleDeg = pick([0, 90, 17, 33, 45, 13, 0.004, -0.006, 89.999, rand() * 180, rand() * 360 - 180]);
  if (drawn && rand() < 0.5) {
    const [d, dx, dy, round] = [pick([0.003, -0.007, 17, 45, rand() * 360]), int(-50000, 50000), int(-50000, 50000), rand() < 0.5];
    outline = turned(outline, d, dx, dy, round);
    for (const e of exclusions) {
      if (e.polygon) e.polygon = turned(e.polygon as Pt[], d, dx, dy, round);
      else e.at = turned([e.at as Pt], d, dx, dy, round)[0];
    }
    angleDeg += d;
  }
  return {
    format: 'quiltline-plan/1',
    name: `random ${i}`,
    outline,
    eavesEdges: outline.map((_, j) => j).filter(() => rand() < 0.25),
    eavesGapMm: pick([0, 25, 50, 100, 250]),
    ...(rand() < 0.2 ? { eavesMode: pick(['gap', 'ventilators'] as const) } : {}),
    joists: {
      angleDeg,
      centresMm: pick([400, 600, 450, 300]),
      widthMm: pick([47, 38, 63]),
      depthMm: pick([100, 75, 150]),
      offsetMm: rand() < 0.5 ? int(0, 599) : rand() * 600,
    },
    exclusions,
    existing: { depthMm: pick([0, 25, 50, 100, 150, 200]), condition: pick(['good', 'compressed', 'damp', 'patchy', 'none'] as const) },
    target: rand() < 0.7 ? { depthMm: pick([270, 300, 200, 400]) } : { uValue: pick([0.16, 0.13, 0.11, 0.2]) },
  };
}

function settingsFor(i: number): Partial<TakeoffSettings> | undefined {
  if (i % 5 !== 1) return undefined;
  return {
    targetBasis: pick(['whole-ceiling', 'insulated-area'] as const),
    minOffcutMm: pick([300, 500, 800]),
    minStripWidthMm: pick([50, 100, 150]),
    cuttingAllowanceMm: pick([5, 10, 20]),
    wasteAllowancePct: pick([5, 10]),
  };
}

let cases = 0;
let differences = 0;
function check(name: string, plan: Plan, settings?: Partial<TakeoffSettings>): void {
  const [ours, theirs] = sides.map(([compute, products]) => {
    try {
      return JSON.stringify(compute(plan, { products, settings }));
    } catch (e) {
      return `error: ${(e as Error).message}`;
    }
  });
  cases++;
  if (ours === theirs) return;
  differences++;
  if (differences > 5) return;
  let k = 0;
  while (ours[k] === theirs[k]) k++;
  console.log(
    `${name}: differs at character ${k}\n  this tree: …${ours.slice(Math.max(0, k - 120), k + 120)}\n  base:      …${theirs.slice(Math.max(0, k - 120), k + 120)}`,
  );
}

const parsed = (input: unknown): Plan | undefined => {
  const v = validatePlan(input);
  return v.ok ? v.plan : undefined;
};
const listJson = (dir: string): string[] =>
  readdirSync(dir).flatMap((n) => {
    const p = join(dir, n);
    return statSync(p).isDirectory() ? listJson(p) : n.endsWith('.json') && n !== 'products.json' ? [p] : [];
  });
for (const file of listJson(join(root, 'examples')).sort()) {
  const plan = parsed(JSON.parse(readFileSync(file, 'utf8')));
  if (!plan) continue;
  check(file, plan);
  for (const deg of [0, 17, 33, 45, 90]) check(`${file} at ${deg}°`, { ...plan, joists: { ...plan.joists, angleDeg: deg } });
}
for (const deg of [0, 13, 17, 33, 45, 60, 90, 0.01, 137]) check(`stress at ${deg}°`, parsed(stressPlan(7, 400, 100, deg))!);
for (let s = 1; s <= 12; s++) {
  const plan = parsed(stressPlan(s, 100 + 40 * s, 20 + 10 * s, s * 11.3));
  if (plan) check(`stress seed ${s}`, plan, s % 3 === 0 ? { targetBasis: 'insulated-area', minOffcutMm: 300 } : undefined);
}
for (let i = 0, valid = 0; valid < N; i++) {
  const plan = parsed(randomPlan(i));
  if (!plan) continue;
  valid++;
  check(`random plan ${i}`, plan, settingsFor(i));
}
console.log(`${cases} takeoffs compared, ${differences} differ`);
process.exit(differences ? 1 : 0);
