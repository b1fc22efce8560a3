/**
 * Thermal transmittance of a ceiling under a loft by the combined method of BS EN ISO 6946
 * (upper and lower bound of the total resistance, averaged), as set out in the Scottish
 * Government's "Tables of U-values and thermal conductivity", Annex 6.B (Feb 2020):
 *   R_upper = 1 / Σ(f_j / R_Tj) over the heat-flow paths, each summed surface to surface;
 *   R_lower = Σ layers, each bridged layer replaced by 1 / Σ(f_j / R_j);
 *   U = 1 / ((R_upper + R_lower) / 2).
 * Resistances in m²K/W, conductivities in W/mK, thicknesses in mm, U in W/m²K.
 */

/** One layer of a build-up: a plain layer, a fixed resistance, or a layer bridged by sections. */
export type ThermalLayer =
  | { kind: 'homogeneous'; thicknessMm: number; lambda: number }
  | { kind: 'resistance'; r: number }
  /** Sections side by side, each with its area fraction (summing to 1) and resistance. */
  | { kind: 'bridged'; sections: { fraction: number; r: number }[] };

/** Result of the combined method. */
export interface CombinedMethodResult {
  rUpper: number;
  rLower: number;
  /** (R_upper + R_lower) / 2, m²K/W. */
  rTotal: number;
  /** 1 / rTotal, W/m²K. */
  uValue: number;
}

function layerR(l: Exclude<ThermalLayer, { kind: 'bridged' }>): number {
  return l.kind === 'resistance' ? l.r : l.thicknessMm / 1000 / l.lambda;
}

/**
 * The ISO 6946 combined method over `layers` between the surface resistances `rsi` and `rse`.
 * With several bridged layers the path fractions multiply (Annex 6.B.3), so the number of
 * paths is the product of the section counts. No bridged layer: R_upper = R_lower.
 */
export function combinedMethod(layers: ThermalLayer[], rsi: number, rse: number): CombinedMethodResult {
  let plain = rsi + rse;
  let lower = rsi + rse;
  const bridged: { fraction: number; r: number }[][] = [];
  for (const l of layers) {
    if (l.kind === 'bridged') {
      bridged.push(l.sections);
      let conductance = 0;
      for (const s of l.sections) conductance += s.fraction / s.r;
      lower += 1 / conductance;
    } else {
      const r = layerR(l);
      plain += r;
      lower += r;
    }
  }
  let conductanceUpper = 0;
  const walk = (i: number, fraction: number, r: number) => {
    if (i === bridged.length) {
      conductanceUpper += fraction / r;
      return;
    }
    for (const s of bridged[i]) walk(i + 1, fraction * s.fraction, r + s.r);
  };
  walk(0, 1, plain);
  const rUpper = 1 / conductanceUpper;
  const rTotal = (rUpper + lower) / 2;
  return { rUpper, rLower: lower, rTotal, uValue: 1 / rTotal };
}

/** Insulation in a loft build-up, bottom (ceiling side) first. */
export interface InsulationLayer {
  thicknessMm: number;
  lambda: number;
}

/** What the loft U-value needs besides the insulation. */
export interface LoftThermalContext {
  joistCentresMm: number;
  joistWidthMm: number;
  joistDepthMm: number;
  rsi: number;
  rse: number;
  roofSpaceResistance: number;
  ceilingBoardMm: number;
  ceilingBoardLambda: number;
  timberLambda: number;
}

/**
 * U-value of a ceiling under a ventilated loft, W/m²K. Insulation fills the joist depth first:
 * the part below the joist tops is bridged by the joists (timber fraction = width / centres),
 * the rest lies continuous over them. Convention (UK practice): the roof-space resistance is
 * added to Rse. The joist depth above the insulation is left out (an air gap counted as zero),
 * which errs on the safe side. With no insulation the joists are left out entirely.
 */
export function loftCombinedMethod(insulation: InsulationLayer[], ctx: LoftThermalContext): CombinedMethodResult {
  const f = Math.min(1, ctx.joistWidthMm / ctx.joistCentresMm);
  const layers: ThermalLayer[] = [{ kind: 'homogeneous', thicknessMm: ctx.ceilingBoardMm, lambda: ctx.ceilingBoardLambda }];
  let filled = 0;
  let rBetween = 0;
  for (const l of insulation) {
    if (!(l.thicknessMm > 0)) continue;
    const below = Math.max(0, Math.min(l.thicknessMm, ctx.joistDepthMm - filled));
    if (below > 0) rBetween += below / 1000 / l.lambda;
    filled += below;
    const above = l.thicknessMm - below;
    if (above > 0) layers.push({ kind: 'homogeneous', thicknessMm: above, lambda: l.lambda });
  }
  if (filled > 0) {
    layers.splice(1, 0, {
      kind: 'bridged',
      sections: [
        { fraction: 1 - f, r: rBetween },
        { fraction: f, r: filled / 1000 / ctx.timberLambda },
      ],
    });
  }
  layers.push({ kind: 'resistance', r: ctx.roofSpaceResistance });
  return combinedMethod(layers, ctx.rsi, ctx.rse);
}

/**
 * Extra continuous depth (mm) of insulation with conductivity `lambda` laid over `insulation`
 * that brings the U-value down to `targetU`, rounded up to whole mm; 0 when already met;
 * `null` when not reachable within 2000 mm. Bisection on the monotone U(depth).
 */
export function depthForTargetU(insulation: InsulationLayer[], lambda: number, targetU: number, ctx: LoftThermalContext): number | null {
  const u = (extra: number) => loftCombinedMethod([...insulation, { thicknessMm: extra, lambda }], ctx).uValue;
  if (u(0) <= targetU) return 0;
  if (u(2000) > targetU) return null;
  let lo = 0;
  let hi = 2000;
  while (hi - lo > 0.5) {
    const mid = (lo + hi) / 2;
    if (u(mid) <= targetU) hi = mid;
    else lo = mid;
  }
  return Math.ceil(hi);
}

/**
 * RdSAP 2012 (SAP 2012 Appendix S, v9.94, 2019) Table S9: roof U-values (W/m²K) by loft
 * insulation thickness at joists, slates or tiles (as transcribed in the building-energy/rdsap2012
 * repository, tables/table_S9_roof_u_values.csv). Rows are [mm, U].
 */
export const RDSAP_S9_ROOF_U: ReadonlyArray<readonly [number, number]> = Object.freeze([
  [0, 2.3],
  [12, 1.5],
  [25, 1.0],
  [50, 0.68],
  [75, 0.5],
  [100, 0.4],
  [150, 0.3],
  [200, 0.21],
  [250, 0.17],
  [270, 0.16],
  [300, 0.14],
  [350, 0.12],
  [400, 0.11],
] as const);

/**
 * Table S9 lookup, W/m²K. A depth between rows takes the row at or below it (the thinner, higher
 * U: Quiltline's conservative convention, not a rule of the table); 400 mm and over give 0.11.
 */
export function rdsapRoofUValue(depthMm: number): number {
  let u = RDSAP_S9_ROOF_U[0][1];
  for (const [mm, value] of RDSAP_S9_ROOF_U) if (depthMm >= mm) u = value;
  return u;
}

/** One m²K/W in h·ft²·°F/Btu (the imperial R-value unit): 1 / 0.1761102 (NIST Guide to the SI, SP 811, Appendix B.8). */
export const R_SI_TO_IP = 5.678263;

/** Imperial R-value (h·ft²·°F/Btu) of an SI resistance in m²K/W. */
export function rValueImperial(rSi: number): number {
  return rSi * R_SI_TO_IP;
}
