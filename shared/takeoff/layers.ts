import type { Plan } from '../plan/plan-schema';
import { loftCombinedMethod, type InsulationLayer, type LoftThermalContext } from './thermal';
import { productFitsRole, productLaneWidthMm, type LayerRole, type TakeoffProduct } from './products';
import type { TakeoffSettings } from './settings';

/** One layer the takeoff proposes, before its strips are cut. */
export interface LayerChoice {
  role: LayerRole;
  product: TakeoffProduct;
  /** 0 for the base layer; 0, 1, 2… for cross layers in laying order. */
  roleIndex: number;
}

/** What the layer choice found, with messages for the estimator. */
export interface LayerPlan {
  layers: LayerChoice[];
  /** Existing depth that still counts after its condition, mm. */
  existingEffectiveMm: number;
  /** Whether the existing layer is missing or poor, so a base layer goes between the joists. */
  baseNeeded: boolean;
  warnings: { code: string; message: string }[];
}

/** The thermal context of a plan under the given settings. */
export function thermalContext(plan: Plan, s: TakeoffSettings): LoftThermalContext {
  return {
    joistCentresMm: plan.joists.centresMm,
    joistWidthMm: plan.joists.widthMm,
    joistDepthMm: plan.joists.depthMm,
    rsi: s.rsi,
    rse: s.rse,
    roofSpaceResistance: s.roofSpaceResistance,
    ceilingBoardMm: s.ceilingBoardMm,
    ceilingBoardLambda: s.ceilingBoardLambda,
    timberLambda: s.timberLambda,
  };
}

/** Existing insulation as it still counts: depth × the condition's factor, mm. */
export function existingEffectiveDepthMm(plan: Plan, s: TakeoffSettings): number {
  return plan.existing.depthMm * (s.existingConditionFactor[plan.existing.condition] ?? 0);
}

/** The existing layer as an insulation layer (empty when nothing counts). */
export function existingInsulation(plan: Plan, s: TakeoffSettings): InsulationLayer[] {
  const d = existingEffectiveDepthMm(plan, s);
  return d > 0 ? [{ thicknessMm: d, lambda: plan.existing.lambda ?? s.existingLambda }] : [];
}

/** Build-up bottom-up: existing, then each chosen layer. */
export function insulationBuildUp(plan: Plan, s: TakeoffSettings, layers: LayerChoice[]): InsulationLayer[] {
  return [...existingInsulation(plan, s), ...layers.map((l) => ({ thicknessMm: l.product.thicknessMm, lambda: l.product.lambda }))];
}

const costPerM2 = (p: TakeoffProduct) => p.priceMinor / p.coverageM2PerRoll;

/**
 * Chooses the layers for a plan. Base layer: when the existing layer is missing or poor (its
 * condition is not `good`, or what counts of it is under half the joist depth), a product whose
 * lane is at least the bay width (`centres − width`), the narrowest such lane, the thinnest
 * thickness that fills the joist depth, then the cheapest. Cross layers: combinations of up to
 * `maxCrossLayers` products that reach the target depth (or target U-value), preferring fewer
 * layers, then the least overshoot, then the lowest cost, then the widest lanes. Products pinned in `plan.products` are
 * used as given. Rules are Quiltline's own reading of common practice.
 */
export function chooseLayers(plan: Plan, products: TakeoffProduct[], s: TakeoffSettings): LayerPlan {
  const warnings: LayerPlan['warnings'] = [];
  const byId = new Map(products.map((p) => [p.id, p]));
  const existingEffectiveMm = existingEffectiveDepthMm(plan, s);
  const depth = plan.joists.depthMm;
  const bay = plan.joists.centresMm - plan.joists.widthMm;
  const baseNeeded = plan.existing.condition !== 'good' || existingEffectiveMm < depth / 2;
  const layers: LayerChoice[] = [];

  const pinnedBase = plan.products?.baseProductId;
  let base: TakeoffProduct | undefined;
  if (pinnedBase) {
    base = byId.get(pinnedBase);
    if (!base) warnings.push({ code: 'product.unknown', message: `base product "${pinnedBase}" is not in the catalogue; choosing one instead` });
  }
  if (!base && baseNeeded) {
    const need = Math.max(1, depth - existingEffectiveMm);
    const candidates = products.filter((p) => productFitsRole(p, 'base'));
    const fitting = candidates.filter((p) => productLaneWidthMm(p) >= bay);
    const pool = fitting.length ? fitting : candidates;
    if (candidates.length && !fitting.length) {
      warnings.push({
        code: 'base.lane-narrow',
        message: `no base product has a lane of at least the ${round1(bay)} mm bay; the widest lane is used and will leave gaps`,
      });
    }
    base = pool.slice().sort((a, b) => {
      const la = productLaneWidthMm(a);
      const lb = productLaneWidthMm(b);
      if (!fitting.length) return lb - la;
      const ta = a.thicknessMm >= need ? a.thicknessMm : 10_000 - a.thicknessMm;
      const tb = b.thicknessMm >= need ? b.thicknessMm : 10_000 - b.thicknessMm;
      return la - lb || ta - tb || costPerM2(a) - costPerM2(b);
    })[0];
    if (!base) warnings.push({ code: 'base.no-product', message: 'the catalogue has no product for a base layer' });
  }
  if (base) layers.push({ role: 'base', product: base, roleIndex: 0 });

  const pinnedCross = plan.products?.crossProductIds;
  if (pinnedCross && pinnedCross.length) {
    pinnedCross.forEach((id, i) => {
      const p = byId.get(id);
      if (p) layers.push({ role: 'cross', product: p, roleIndex: i });
      else warnings.push({ code: 'product.unknown', message: `cross product "${id}" is not in the catalogue; left out` });
    });
    return { layers, existingEffectiveMm, baseNeeded, warnings };
  }

  const crossPool = products.filter((p) => productFitsRole(p, 'cross'));
  const combos = crossCombinations(crossPool, s.maxCrossLayers);
  const ctx = thermalContext(plan, s);
  const below = insulationBuildUp(plan, s, layers);
  const belowMm = below.reduce((t, l) => t + l.thicknessMm, 0);
  let chosen: TakeoffProduct[] = [];
  if ('depthMm' in plan.target) {
    const need = plan.target.depthMm - belowMm;
    if (need > 0) {
      const ok = combos.filter((c) => sum(c) >= need);
      if (ok.length) chosen = pickBest(ok, (c) => [c.length, sum(c) - need, c.reduce((t, p) => t + costPerM2(p), 0), -minLane(c)]);
      else if (combos.length) {
        chosen = pickBest(combos, (c) => [-sum(c), c.length]);
        warnings.push({
          code: 'target.not-reached',
          message: `the catalogue reaches ${Math.round(belowMm + sum(chosen))} mm at most with ${s.maxCrossLayers} cross layers; the target is ${plan.target.depthMm} mm`,
        });
      }
    } else if (!layers.length) {
      warnings.push({
        code: 'target.already-met',
        message: `the existing ${Math.round(existingEffectiveMm)} mm already meets the ${plan.target.depthMm} mm target; no new layer is needed`,
      });
    }
  } else {
    const target = plan.target.uValue;
    const u = (c: TakeoffProduct[]) => loftCombinedMethod([...below, ...c.map((p) => ({ thicknessMm: p.thicknessMm, lambda: p.lambda }))], ctx).uValue;
    if (u([]) > target) {
      const scored = combos.map((c) => ({ c, u: u(c) }));
      const ok = scored.filter((x) => x.u <= target);
      if (ok.length) chosen = pickBest(ok, (x) => [x.c.length, sum(x.c), x.c.reduce((t, p) => t + costPerM2(p), 0), -minLane(x.c)]).c;
      else if (scored.length) {
        const best = pickBest(scored, (x) => [x.u, x.c.length]);
        chosen = best.c;
        warnings.push({ code: 'target.not-reached', message: `the best the catalogue reaches is U ${best.u.toFixed(3)} W/m²K; the target is ${target} W/m²K` });
      }
    } else if (!layers.length) {
      warnings.push({ code: 'target.already-met', message: `the ceiling already meets U ${target} W/m²K; no new layer is needed` });
    }
  }
  // Thicker layers first: the deep layer goes down before the top-up.
  chosen
    .slice()
    .sort((a, b) => b.thicknessMm - a.thicknessMm)
    .forEach((p, i) => layers.push({ role: 'cross', product: p, roleIndex: i }));
  return { layers, existingEffectiveMm, baseNeeded, warnings };
}

function sum(c: TakeoffProduct[]): number {
  return c.reduce((t, p) => t + p.thicknessMm, 0);
}

/**
 * Narrowest lane of a combination, the last tie-break of the cross choice: of the needed thickness
 * and cost, the widest lane (an unsplit roll) wins, since over the joists a full-width roll means
 * fewer strips to cut and fewer joints (common practice). The base layer instead takes the
 * narrowest lane that fills the bay (see `chooseLayers`).
 */
function minLane(c: TakeoffProduct[]): number {
  return Math.min(...c.map(productLaneWidthMm));
}

function round1(x: number): number {
  return Math.round(x * 10) / 10;
}

/** All multisets of 1..max products (order-free), as arrays. */
function crossCombinations(pool: TakeoffProduct[], max: number): TakeoffProduct[][] {
  const out: TakeoffProduct[][] = [];
  const rec = (start: number, acc: TakeoffProduct[]) => {
    if (acc.length) out.push(acc.slice());
    if (acc.length === max) return;
    for (let i = start; i < pool.length; i++) {
      acc.push(pool[i]);
      rec(i, acc);
      acc.pop();
    }
  };
  rec(0, []);
  return out;
}

function pickBest<T>(items: T[], key: (x: T) => number[]): T {
  let best = items[0];
  let bestKey = key(best);
  for (let i = 1; i < items.length; i++) {
    const k = key(items[i]);
    for (let j = 0; j < k.length; j++) {
      if (Math.abs(k[j] - bestKey[j]) < 1e-9) continue;
      if (k[j] < bestKey[j]) {
        best = items[i];
        bestKey = k;
      }
      break;
    }
  }
  return best;
}
