import type { Plan } from '../plan/plan-schema';
import { InvalidPlanError } from '../plan/plan-messages';
import { checkPlanGeometry } from '../plan/plan-geometry-checks';
import { multiPolygonArea, polygonCentroid } from '../geometry/polygon';
import type { Vec2 } from '../geometry/vector';
import { computePlanRegions, countExclusionsByKind } from './regions';
import { chooseLayers, existingInsulation, insulationBuildUp, thermalContext } from './layers';
import { buildLayer } from './build-layer';
import { applyRollPlans } from './layer-roll-plan';
import { depthForTargetU, loftCombinedMethod, rdsapRoofUValue, rValueImperial, type InsulationLayer, type LoftThermalContext } from './thermal';
import { yearlySavings } from './savings';
import { wholeCeilingModel } from './whole-ceiling';
import { eavesSummary } from './eaves';
import { siteChecksFor } from './site-checks';
import { resolveSettings, type TakeoffSettings } from './settings';
import type { TakeoffProduct } from './products';
import { TAKEOFF_FORMAT, type PlanPointMm, type Takeoff, type TakeoffThermalState } from './takeoff-types';

export * from './takeoff-types';
export { DEFAULT_TAKEOFF_SETTINGS } from './settings';
export type { TakeoffSettings } from './settings';
export type { TakeoffProduct } from './products';

/** What a takeoff needs besides the plan. */
export interface TakeoffOptions {
  /** The company's roll products (see `parseProductCatalogue` and examples/products.json). */
  products: TakeoffProduct[];
  /** Company settings; anything left out takes `DEFAULT_TAKEOFF_SETTINGS`. */
  settings?: Partial<TakeoffSettings>;
}

// `+ 0` turns -0 into 0, which JSON cannot tell apart anyway.
const r1 = (x: number) => Math.round(x * 10) / 10 + 0;
const r3 = (x: number) => Math.round(x * 1000) / 1000 + 0;
const r4 = (x: number) => Math.round(x * 10000) / 10000 + 0;
const pt = (p: readonly number[]): PlanPointMm => [r1(p[0]), r1(p[1])];
const m2 = (mm2: number) => mm2 / 1e6;

/**
 * The takeoff of one plan: net areas, layers, numbered strips with their plan geometry, the
 * roll plan, both roll counts, U-values before and after (ISO 6946 combined method), the yearly
 * saving and the site checks. Pure and synchronous (no I/O); the same code runs in the editor on
 * every change and on the server. The plan must already be parsed by `planSchema` (use
 * `validatePlan` for raw input); geometric errors throw `InvalidPlanError` with the messages.
 * Areas in m² (3 decimals), lengths in mm, U in W/m²K (4 decimals), money in minor units.
 */
export function computeTakeoff(plan: Plan, options: TakeoffOptions): Takeoff {
  const settings = resolveSettings(options.settings);
  const checks = checkPlanGeometry(plan);
  if (checks.errors.length) throw new InvalidPlanError(checks.errors);
  const warnings: Takeoff['warnings'] = checks.warnings.map(({ code, message, edgeIndex, exclusionIndex, pointIndex }) =>
    strip({ code, message, edgeIndex, exclusionIndex, pointIndex }),
  );

  const regions = computePlanRegions(plan, settings);
  const ctx = thermalContext(plan, settings);
  const ceiling = wholeCeilingModel(plan, regions, settings, ctx);
  const wholeBasis = settings.targetBasis === 'whole-ceiling';
  const layerPlan = chooseLayers(plan, options.products, settings, wholeBasis ? ceiling.judgeAfter : undefined);
  warnings.push(...layerPlan.warnings);

  const hatchIndex = plan.exclusions.findIndex((e) => e.kind === 'hatch');
  const outlineCentre = polygonCentroid(regions.outline);
  const hatch = plan.exclusions[hatchIndex];
  const reference: Vec2 = hatch ? (hatch.at ? [hatch.at[0], hatch.at[1]] : polygonCentroid(hatch.polygon!)) : outlineCentre;

  const built = layerPlan.layers.map((choice) => buildLayer(plan, choice, regions.layerRegion, regions.layerAreaMm2, reference, outlineCentre, settings));
  const prices = new Map(layerPlan.layers.map((c) => [c.product.id, c.product.priceMinor]));
  const rollPlan = applyRollPlans(built, settings, (id) => prices.get(id) ?? 0);
  const layers = built.map((b) => b.layer);

  const beforeLayers = existingInsulation(plan, settings);
  const afterLayers = insulationBuildUp(plan, settings, layerPlan.layers);
  // RdSAP looks up the depth that counts: the existing layer by its credit, new layers in full.
  const newMm = layerPlan.layers.reduce((t, l) => t + l.product.thicknessMm, 0);
  const before = thermalState(beforeLayers, ctx, layerPlan.existingEffectiveMm);
  const after = thermalState(afterLayers, ctx, layerPlan.existingEffectiveMm + newMm);
  const targetU = 'uValue' in plan.target ? plan.target.uValue : undefined;
  const firstCross = layerPlan.layers.find((l) => l.role === 'cross')?.product;
  const base = layerPlan.layers.filter((l) => l.role === 'base');
  const whole = ceiling.evaluate(before.uValue, after.uValue);
  // On the whole-ceiling basis the insulated area must reach the U that brings the mean to the target.
  const insulatedTarget = targetU === undefined ? undefined : wholeBasis ? ceiling.insulatedUFor(targetU) : targetU;
  const depthForTarget =
    insulatedTarget === undefined
      ? undefined
      : insulatedTarget === null
        ? null
        : depthForTargetU(insulationBuildUp(plan, settings, base), firstCross?.lambda ?? 0.044, insulatedTarget, ctx);
  const judged = wholeBasis ? whole.uAfter : after.uValue;
  // The saving over the whole ceiling: parts that do not change add nothing, a hatch kit's credit counts.
  const savings = yearlySavings(whole.uBefore, whole.uAfter, ceiling.areaM2, settings.degreeDays, settings.heatingEfficiency, settings.fuelPriceMinorPerKwh);

  const outside = new Set(checks.warnings.filter((w) => w.code === 'exclusion.outside-outline').map((w) => w.exclusionIndex!));
  const countsByKind = countExclusionsByKind(plan, outside);
  const items = plan.exclusions.map((e, index) => ({
    index,
    kind: e.kind,
    ...(e.label ? { label: e.label } : {}),
    ...(e.kind === 'boarded' ? { boards: e.boards ?? ('leave' as const) } : {}),
    clearanceMm: regions.exclusionClearancesMm[index],
    insideOutline: !outside.has(index),
    footprintAreaM2: r3(m2(multiPolygonArea(regions.exclusionShapes[index]))),
    polygons: regions.exclusionShapes[index].map((p) => p[0].map(pt)),
  }));
  const boardedAreaM2 = r3(items.filter((x) => x.kind === 'boarded' && x.insideOutline).reduce((t, x) => t + x.footprintAreaM2, 0));
  const raisedBoardedAreaM2 = r3(items.filter((x) => x.boards === 'raise' && x.insideOutline).reduce((t, x) => t + x.footprintAreaM2, 0));
  const eavesLengthMm = regions.eavesBands.reduce((t, b) => t + b.edgeLengthMm, 0);
  const eaves = eavesSummary(plan, settings, regions.eavesBands);

  const siteChecks = siteChecksFor(plan, {
    countsByKind,
    clearancesMm: regions.exclusionClearancesMm,
    eavesLengthMm,
    boardedAreaM2,
    raisedBoardedAreaM2,
    hasLayers: layers.length > 0,
    aboveJoists: afterLayers.reduce((t, l) => t + l.thicknessMm, 0) > plan.joists.depthMm,
    finishedDepthMm: afterLayers.reduce((t, l) => t + l.thicknessMm, 0),
    eaves,
    ignored: outside,
  });

  const byProduct = new Map<string, Takeoff['rollsPerProduct'][number]>();
  for (const l of layers) {
    const row = byProduct.get(l.productId) ?? {
      productId: l.productId,
      productName: l.productName,
      rollsByPacking: 0,
      rollsByArea: 0,
      rollsLowerBound: rollPlan.find((r) => r.productId === l.productId)?.rollsLowerBound ?? 0,
      priceMinor: 0,
    };
    row.rollsByPacking += l.rollsByPacking;
    row.rollsByArea += l.rollsByArea;
    row.priceMinor += l.priceMinor;
    byProduct.set(l.productId, row);
  }

  return {
    format: TAKEOFF_FORMAT,
    planName: plan.name,
    grossAreaM2: r3(m2(regions.grossAreaMm2)),
    netAreaM2: r3(m2(regions.netAreaMm2)),
    excludedAreaM2: r3(m2(regions.excludedAreaMm2)),
    eavesBandAreaM2: r3(m2(regions.netAreaMm2 - regions.layerAreaMm2)),
    layerAreaM2: r3(m2(regions.layerAreaMm2)),
    wasteAllowancePct: settings.wasteAllowancePct,
    existing: {
      depthMm: plan.existing.depthMm,
      condition: plan.existing.condition,
      effectiveDepthMm: r1(layerPlan.existingEffectiveMm),
      physicalDepthMm: r1(layerPlan.existingPhysicalMm),
      baseNeeded: layerPlan.baseNeeded,
    },
    target: plan.target,
    productChoice: {
      source: plan.products?.baseProductId || plan.products?.crossProductIds?.length ? 'plan' : 'catalogue',
      baseProductId: layers.find((l) => l.role === 'base')?.productId ?? null,
      crossProductIds: layers.filter((l) => l.role === 'cross').map((l) => l.productId),
    },
    layers,
    rollsPerProduct: [...byProduct.values()],
    rollPlan,
    uValueBefore: before.uValue,
    uValueAfter: after.uValue,
    uValueBeforeWholeCeiling: r4(whole.uBefore),
    uValueAfterWholeCeiling: r4(whole.uAfter),
    rValueBeforeImperial: before.rTotalImperial,
    rValueAfterImperial: after.rTotalImperial,
    thermal: {
      before,
      after,
      method: 'BS EN ISO 6946 combined method; Rsi 0.10, Rse 0.04, roof space resistance added to Rse; joists bridge the insulation below their tops',
      rdsapSource: 'RdSAP 2012 (SAP 2012 Appendix S) Table S9: default roof U-value for the insulation depth at the joists',
      ...(targetU !== undefined ? { targetUValue: targetU, depthForTargetUMm: depthForTarget } : {}),
      targetJudgedOn: targetU === undefined ? 'depth' : wholeBasis ? 'whole-ceiling' : 'insulated-area',
      meetsTarget:
        targetU !== undefined ? judged <= targetU + 1e-9 : layerPlan.existingEffectiveMm + newMm >= (plan.target as { depthMm: number }).depthMm - 1e-9,
      wholeCeiling: {
        areaM2: r3(ceiling.areaM2),
        parts: whole.parts.map((p) => ({ part: p.part, areaM2: r3(p.areaM2), uBefore: r4(p.uBefore), uAfter: r4(p.uAfter), basis: p.basis })),
      },
    },
    savings: {
      areaM2: r3(savings.areaM2),
      deltaU: r4(savings.deltaU),
      heatKwhPerYear: r1(savings.heatKwhPerYear),
      fuelKwhPerYear: r1(savings.fuelKwhPerYear),
      moneyMinorPerYear: savings.moneyMinorPerYear,
      degreeDays: settings.degreeDays,
      heatingEfficiency: settings.heatingEfficiency,
      fuelPriceMinorPerKwh: settings.fuelPriceMinorPerKwh,
      note: 'Saving estimated by the degree-day method over the whole ceiling: the 15.5 °C base temperature of the degree days allows for typical internal and solar gains; partial heating and a home kept cooler or warmer than usual are not modelled.',
    },
    exclusions: { countsByKind, items, boardedAreaM2, raisedBoardedAreaM2 },
    eaves: {
      ...eaves,
      gapMm: plan.eavesGapMm,
      totalLengthMm: r1(eavesLengthMm),
      bands: regions.eavesBands.map((b) => ({
        edgeIndex: b.edgeIndex,
        edgeLengthMm: r1(b.edgeLengthMm),
        areaM2: r3(m2(b.areaMm2)),
        polygon: b.polygon.map(pt),
      })),
    },
    siteChecks,
    warnings,
    settings,
  };
}

function strip<T extends object>(o: T): T {
  for (const k of Object.keys(o) as (keyof T)[]) if (o[k] === undefined) delete o[k];
  return o;
}

function thermalState(layers: InsulationLayer[], ctx: LoftThermalContext, creditedMm: number): TakeoffThermalState {
  const res = loftCombinedMethod(layers, ctx);
  const depth = creditedMm;
  return {
    insulationMm: r1(depth),
    rUpper: r4(res.rUpper),
    rLower: r4(res.rLower),
    rTotal: r4(res.rTotal),
    rTotalImperial: r3(rValueImperial(res.rTotal)),
    uValue: r4(res.uValue),
    rdsapU: rdsapRoofUValue(depth),
  };
}
