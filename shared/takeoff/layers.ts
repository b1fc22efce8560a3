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
  /** Existing depth that still counts after its condition, mm (thermal credit only). */
  existingEffectiveMm: number;
  /** Existing depth as it lies in the bays, whatever its condition, mm. */
  existingPhysicalMm: number;
  /** Whether the bays are not yet full (physical depth below the joist tops), so a base layer goes between the joists. */
  baseNeeded: boolean;
  warnings: { code: string; message: string }[];
}

/**
 * Maps the U-value of the insulated area to the figure a U-value target is judged on (the identity
 * for the insulated area; an area-weighted mean for the whole ceiling, see `wholeCeilingJudge`).
 */
export type TargetJudge = (insulatedU: number) => number;

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

/** Share of the existing depth credited for its condition (0 for `none`), 0–1. */
export function existingConditionFactor(plan: Plan, s: TakeoffSettings): number {
  return s.existingConditionFactor[plan.existing.condition] ?? 0;
}

/**
 * Existing depth as it physically lies in the bays, mm: the typed depth whatever its condition
 * (a patchy or compressed layer still takes up the bay); 0 only for condition `none`, which
 * means no insulation at all.
 */
export function existingPhysicalDepthMm(plan: Plan): number {
  return plan.existing.condition === 'none' ? 0 : plan.existing.depthMm;
}

/** Existing insulation as it still counts: depth × the condition's factor, mm. */
export function existingEffectiveDepthMm(plan: Plan, s: TakeoffSettings): number {
  return plan.existing.depthMm * existingConditionFactor(plan, s);
}

/**
 * The existing layer as an insulation layer: its physical depth (so new layers sit where they
 * really lie, above it) with its conductivity divided by the condition factor, which gives the
 * same resistance as the credited depth at full conductivity (200 mm patchy at 0.044 / 0.5 =
 * 0.088 W/mK has R 2.27, as 100 mm good). Empty when nothing counts (damp or none): the damp
 * layer is then given no resistance at all, the safe side.
 */
export function existingInsulation(plan: Plan, s: TakeoffSettings): InsulationLayer[] {
  const f = existingConditionFactor(plan, s);
  const d = existingPhysicalDepthMm(plan);
  return d > 0 && f > 0 ? [{ thicknessMm: d, lambda: (plan.existing.lambda ?? s.existingLambda) / f }] : [];
}

/** Build-up bottom-up: existing, then each chosen layer. */
export function insulationBuildUp(plan: Plan, s: TakeoffSettings, layers: LayerChoice[]): InsulationLayer[] {
  return [...existingInsulation(plan, s), ...layers.map((l) => ({ thicknessMm: l.product.thicknessMm, lambda: l.product.lambda }))];
}

const costPerM2 = (p: TakeoffProduct) => p.priceMinor / p.coverageM2PerRoll;

/**
 * Chooses the layers for a plan.
 * Base layer: when the bays are not yet full — the existing depth as it lies (whatever its
 * condition) is more than `baseFillToleranceMm` below the joist tops — a product whose lane is at
 * least the bay width (`centres − width`), the narrowest such lane, the thinnest thickness that
 * fills what is left of the joist depth, then the cheapest. The condition changes only the thermal
 * credit, never whether the bays are full: 200 mm of patchy wool over 100 mm joists needs no base,
 * 50 mm of good wool in 100 mm joists does (so cross layers never bridge a half-empty bay).
 * Cross layers: combinations of up to `maxCrossLayers` products. A depth target (compared with the
 * credited depth) prefers fewer layers, then the least overshoot, then the lowest cost, then the
 * widest lanes. A U-value target takes, of the combinations that meet it (judged by `judge`, the
 * insulated area by default), the lowest material cost per m², then the fewest layers, then the
 * thinnest, then the widest lanes. Products pinned in `plan.products` are used as given. Rules
 * are Quiltline's own reading of common practice.
 */
export function chooseLayers(plan: Plan, products: TakeoffProduct[], s: TakeoffSettings, judge: TargetJudge = (u) => u): LayerPlan {
  const warnings: LayerPlan['warnings'] = [];
  const byId = new Map(products.map((p) => [p.id, p]));
  const existingEffectiveMm = existingEffectiveDepthMm(plan, s);
  const existingPhysicalMm = existingPhysicalDepthMm(plan);
  const depth = plan.joists.depthMm;
  const bay = plan.joists.centresMm - plan.joists.widthMm;
  const baseNeeded = existingPhysicalMm < depth - s.baseFillToleranceMm;
  if (plan.existing.condition === 'none' && plan.existing.depthMm > 0)
    warnings.push({
      code: 'existing.condition-none',
      message: `the existing ${plan.existing.depthMm} mm has the condition "none", so it counts as no insulation at all: set its condition (good, compressed, patchy or damp)`,
    });
  if (plan.existing.condition === 'damp' && plan.existing.depthMm > 0)
    warnings.push({
      code: 'existing.damp-no-credit',
      message: `the existing ${plan.existing.depthMm} mm is damp: it gets no thermal credit but still fills the bays; if it is to be taken out, set the existing depth to 0 so a base layer is proposed`,
    });
  const layers: LayerChoice[] = [];

  const pinnedBase = plan.products?.baseProductId;
  let base: TakeoffProduct | undefined;
  if (pinnedBase) {
    base = byId.get(pinnedBase);
    if (!base) warnings.push({ code: 'product.unknown', message: `base product "${pinnedBase}" is not in the catalogue; choosing one instead` });
  }
  if (!base && baseNeeded) {
    const need = Math.max(1, depth - existingPhysicalMm);
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
    return { layers, existingEffectiveMm, existingPhysicalMm, baseNeeded, warnings };
  }

  const crossPool = products.filter((p) => productFitsRole(p, 'cross'));
  const combos = crossCombinations(crossPool, s.maxCrossLayers);
  const ctx = thermalContext(plan, s);
  const below = insulationBuildUp(plan, s, layers);
  // The depth target counts the existing layer by its credit, new layers in full.
  const belowMm = existingEffectiveMm + layers.reduce((t, l) => t + l.product.thicknessMm, 0);
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
    const u = (c: TakeoffProduct[]) => judge(loftCombinedMethod([...below, ...c.map((p) => ({ thicknessMm: p.thicknessMm, lambda: p.lambda }))], ctx).uValue);
    if (u([]) > target) {
      const scored = combos.map((c) => ({ c, u: u(c) }));
      const ok = scored.filter((x) => x.u <= target);
      if (ok.length) chosen = pickBest(ok, (x) => [x.c.reduce((t, p) => t + costPerM2(p), 0), x.c.length, sum(x.c), -minLane(x.c)]).c;
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
  return { layers, existingEffectiveMm, existingPhysicalMm, baseNeeded, warnings };
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
