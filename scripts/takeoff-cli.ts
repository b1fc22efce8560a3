/**
 * Quiltline takeoff from the command line.
 *   npm run -s takeoff -- PLAN.json [--products FILE] [--format text|json]
 * Reads a `quiltline-plan/1` file and a product catalogue (default examples/products.json),
 * prints a readable summary (text) or the `quiltline-takeoff/4` JSON. A bad file or argument
 * exits 2 with one line on stderr naming the problem; success exits 0.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { dirname, resolve } from 'node:path';
import { validatePlan } from '../shared/plan/validate-plan';
import { computeTakeoff, type Takeoff } from '../shared/takeoff/compute-takeoff';
import { parseProductCatalogue, type TakeoffProduct } from '../shared/takeoff/products';

class UsageError extends Error {}

const USAGE = 'usage: npm run -s takeoff -- PLAN.json [--products FILE] [--format text|json]';

function parseArgs(argv: string[]): { plan: string; products: string; format: 'text' | 'json' } {
  let plan: string | undefined;
  let products = resolve(dirname(fileURLToPath(import.meta.url)), '../examples/products.json');
  let format: 'text' | 'json' = 'text';
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--products' || a === '--format') {
      const v = argv[++i];
      if (v === undefined) throw new UsageError(`${a} needs a value; ${USAGE}`);
      if (a === '--products') products = v;
      else if (v === 'text' || v === 'json') format = v;
      else throw new UsageError(`--format must be text or json, not "${v}"`);
    } else if (a.startsWith('--')) {
      throw new UsageError(`unknown option ${a}; ${USAGE}`);
    } else if (plan === undefined) {
      plan = a;
    } else {
      throw new UsageError(`one plan file at a time (got "${plan}" and "${a}")`);
    }
  }
  if (!plan) throw new UsageError(USAGE);
  return { plan, products, format };
}

function readJson(path: string, what: string): unknown {
  let text: string;
  try {
    text = readFileSync(path, 'utf8');
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    throw new UsageError(`cannot read ${what} ${path}: ${code === 'ENOENT' ? 'no such file' : code === 'EISDIR' ? 'it is a folder' : (e as Error).message}`);
  }
  try {
    return JSON.parse(text);
  } catch (e) {
    throw new UsageError(`${what} ${path} is not valid JSON: ${(e as Error).message}`);
  }
}

function loadProducts(path: string): TakeoffProduct[] {
  const raw = readJson(path, 'product file');
  try {
    return parseProductCatalogue(raw);
  } catch (e) {
    const issues = (e as { issues?: { path: PropertyKey[]; message: string }[] }).issues;
    const detail = issues?.length ? `${issues[0].path.map(String).join('.') || 'product'}: ${issues[0].message}` : (e as Error).message;
    throw new UsageError(`product file ${path} is not a product catalogue: ${detail}`);
  }
}

const fmt = (x: number, d = 2) => x.toFixed(d);

/** The readable summary: areas, layers with grouped strips, rolls, U-values, saving, site checks. */
export function formatTakeoffText(t: Takeoff): string {
  const out: string[] = [];
  out.push(`${t.planName}  (${t.format})`);
  out.push(
    `Areas      gross ${fmt(t.grossAreaM2)} m², net ${fmt(t.netAreaM2)} m², new layers ${fmt(t.layerAreaM2)} m² (exclusions ${fmt(t.excludedAreaM2)} m², eaves band ${fmt(t.eavesBandAreaM2)} m²)`,
  );
  const target = 'depthMm' in t.target ? `${t.target.depthMm} mm` : `U ${t.target.uValue} W/m²K`;
  out.push(`Existing   ${t.existing.depthMm} mm (${t.existing.condition}, counts as ${t.existing.effectiveDepthMm} mm); target ${target}`);
  if (!t.layers.length) out.push('Layers     none needed');
  for (const l of t.layers) {
    out.push(
      `Layer      ${l.role}${l.role === 'cross' ? ` ${l.roleIndex + 1}` : ''}: ${l.productName} [${l.productId}], ${l.thicknessMm} mm, ${fmt(l.areaM2)} m², lay along (${l.layDirection.join(', ')})`,
    );
    const groups = new Map<number, number>();
    for (const s of l.strips) groups.set(s.lengthMm, (groups.get(s.lengthMm) ?? 0) + 1);
    const list = [...groups]
      .sort((a, b) => b[0] - a[0])
      .map(([len, n]) => `${n} × ${len}`)
      .join(', ');
    out.push(`  strips   ${l.strips.length} strips ${l.laneWidthMm} mm wide (bands ${l.bandWidthMm} mm): ${list} mm`);
    const reusable = l.packing.offcuts.filter((o) => o.reusable).length;
    out.push(
      `  rolls    ${l.rollsByPacking} by packing (${l.packing.lanesUsed} lanes of ${l.rollLengthMm} mm, ${l.lanesPerRoll} per roll; waste ${fmt(l.wastePct, 1)}%, ${reusable} reusable offcuts), ${l.rollsByArea} by area (+${t.wasteAllowancePct}%)`,
    );
  }
  if (t.rollsPerProduct.length) out.push(`Rolls      ${t.rollsPerProduct.map((r) => `${r.rollsByPacking} × ${r.productId}`).join(', ')}`);
  out.push(
    `U-value    before ${fmt(t.uValueBefore, 3)} W/m²K (R-${fmt(t.rValueBeforeImperial, 1)} imperial), after ${fmt(t.uValueAfter, 3)} W/m²K (R-${fmt(t.rValueAfterImperial, 1)} imperial); RdSAP S9 for the same depths ${t.thermal.before.rdsapU} → ${t.thermal.after.rdsapU}`,
  );
  const s = t.savings;
  out.push(
    `Saving     about ${Math.round(s.heatKwhPerYear)} kWh of heat, ${Math.round(s.fuelKwhPerYear)} kWh of fuel a year ≈ ${(s.moneyMinorPerYear / 100).toFixed(2)} a year at ${s.fuelPriceMinorPerKwh} minor units/kWh (estimate)`,
  );
  out.push('Site checks');
  for (const c of t.siteChecks) out.push(`  [${c.code}] ${c.message}`);
  if (t.warnings.length) {
    out.push('Warnings');
    for (const w of t.warnings) out.push(`  [${w.code}] ${w.message}`);
  }
  return out.join('\n');
}

function main(argv: string[]): number {
  const args = parseArgs(argv);
  const products = loadProducts(args.products);
  const result = validatePlan(readJson(args.plan, 'plan file'));
  if (!result.ok) {
    const more = result.errors.length > 1 ? ` (and ${result.errors.length - 1} more problem${result.errors.length > 2 ? 's' : ''})` : '';
    throw new UsageError(`${args.plan} is not a valid plan: ${result.errors[0].message}${more}`);
  }
  const takeoff = computeTakeoff(result.plan, { products });
  process.stdout.write(args.format === 'json' ? `${JSON.stringify(takeoff, null, 2)}\n` : `${formatTakeoffText(takeoff)}\n`);
  return 0;
}

try {
  process.exitCode = main(process.argv.slice(2));
} catch (e) {
  process.stderr.write(`takeoff: ${e instanceof UsageError ? e.message : `unexpected error: ${(e as Error).message}`}\n`);
  process.exitCode = e instanceof UsageError ? 2 : 1;
}
