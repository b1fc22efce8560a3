import { describe, expect, it } from 'vitest';
import {
  combinedMethod,
  loftCombinedMethod,
  depthForTargetU,
  rdsapRoofUValue,
  RDSAP_S9_ROOF_U,
  rValueImperial,
  R_SI_TO_IP,
  type LoftThermalContext,
} from '../../shared/takeoff/thermal';
import { yearlySavings, paybackYears } from '../../shared/takeoff/savings';
import { DEFAULT_TAKEOFF_SETTINGS } from '../../shared/takeoff/settings';

/** Loft context with ISO 6946 surface resistances (Rsi 0.10 upward, Rse 0.04; found) and roof space 0.2 (ISO 6946 table; from memory). */
function loft(centresMm: number): LoftThermalContext {
  return {
    joistCentresMm: centresMm,
    joistWidthMm: 47,
    joistDepthMm: 100,
    rsi: 0.1,
    rse: 0.04,
    roofSpaceResistance: 0.2,
    ceilingBoardMm: 12.5,
    ceilingBoardLambda: 0.21,
    timberLambda: 0.13,
  };
}

describe('ISO 6946 combined method (Scottish Government, Tables of U-values, Annex 6.B, Feb 2020)', () => {
  it('reproduces worked example 6.B.2, a timber-frame wall (R_upper 3.435, R_lower 3.304, U 0.297 as published)', () => {
    const r = combinedMethod(
      [
        { kind: 'homogeneous', thicknessMm: 102, lambda: 0.77 },
        { kind: 'resistance', r: 0.18 },
        { kind: 'homogeneous', thicknessMm: 9, lambda: 0.13 },
        {
          kind: 'bridged',
          sections: [
            { fraction: 0.85, r: 0.14 / 0.04 },
            { fraction: 0.15, r: 0.14 / 0.12 },
          ],
        },
        { kind: 'homogeneous', thicknessMm: 12.5, lambda: 0.21 },
      ],
      0.13,
      0.04,
    );
    expect(r.rUpper).toBeCloseTo(3.435, 2);
    expect(Math.abs(r.rUpper - 3.435)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(r.rLower - 3.304)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(r.uValue - 0.297)).toBeLessThanOrEqual(0.001);
  });

  it('reproduces worked example 6.B.3 with two bridged layers whose fractions multiply (U2)', () => {
    const r = combinedMethod(
      [
        { kind: 'homogeneous', thicknessMm: 102, lambda: 0.77 },
        { kind: 'resistance', r: 0.18 },
        {
          kind: 'bridged',
          sections: [
            { fraction: 0.933, r: 0.125 / 0.11 },
            { fraction: 0.067, r: 0.125 / 0.88 },
          ],
        },
        {
          kind: 'bridged',
          sections: [
            { fraction: 0.882, r: 0.089 / 0.038 },
            { fraction: 0.118, r: 0.089 / 0.13 },
          ],
        },
        { kind: 'homogeneous', thicknessMm: 12.5, lambda: 0.21 },
      ],
      0.13,
      0.04,
    );
    expect(Math.abs(r.rUpper - 3.617)).toBeLessThanOrEqual(0.005);
    expect(Math.abs(r.rLower - 3.136)).toBeLessThanOrEqual(0.005);
    expect(r.uValue).toBeCloseTo(0.3, 2);
  });

  it('gives equal bounds when nothing is bridged', () => {
    const r = combinedMethod([{ kind: 'homogeneous', thicknessMm: 100, lambda: 0.04 }], 0.1, 0.04);
    expect(r.rUpper).toBeCloseTo(r.rLower, 12);
    expect(r.uValue).toBeCloseTo(1 / (0.1 + 2.5 + 0.04), 12);
  });
});

describe('loft U-values (worked by hand with the combined method from the inputs in each row)', () => {
  it.each([
    [
      'U3: 100 mm between 47 mm joists at 600 + 150 mm across, λ 0.040',
      [
        [100, 0.04],
        [150, 0.04],
      ],
      600,
      0.157,
      0.002,
    ],
    [
      'U4: as U3 with joists at 400 mm',
      [
        [100, 0.04],
        [150, 0.04],
      ],
      400,
      0.16,
      0.002,
    ],
    [
      'U5: 100 + 170 mm, λ 0.044',
      [
        [100, 0.044],
        [170, 0.044],
      ],
      600,
      0.1585,
      0.002,
    ],
    ['U6: 100 mm between joists only, λ 0.040', [[100, 0.04]], 600, 0.39, 0.002],
    ['U7: no insulation at all', [], 400, 2.5, 0.01],
  ] as const)('%s', (_name, layers, centres, expected, tol) => {
    const u = loftCombinedMethod(
      layers.map(([thicknessMm, lambda]) => ({ thicknessMm, lambda })),
      loft(centres),
    ).uValue;
    expect(Math.abs(u - expected)).toBeLessThanOrEqual(tol);
  });

  it('lands near published values: 0.16 for 150 + 100 mm (a building-control body) and RdSAP 270 mm 0.16 and 100 mm 0.40', () => {
    expect(
      Math.abs(
        loftCombinedMethod(
          [
            { thicknessMm: 100, lambda: 0.04 },
            { thicknessMm: 150, lambda: 0.04 },
          ],
          loft(600),
        ).uValue - 0.16,
      ),
    ).toBeLessThanOrEqual(0.01);
    expect(
      Math.abs(
        loftCombinedMethod(
          [
            { thicknessMm: 100, lambda: 0.044 },
            { thicknessMm: 170, lambda: 0.044 },
          ],
          loft(600),
        ).uValue - 0.16,
      ),
    ).toBeLessThanOrEqual(0.01);
    expect(Math.abs(loftCombinedMethod([{ thicknessMm: 100, lambda: 0.04 }], loft(600)).uValue - 0.4)).toBeLessThanOrEqual(0.02);
  });

  it('splits a layer that rises above the joists into a bridged part and a continuous part', () => {
    const one = loftCombinedMethod([{ thicknessMm: 250, lambda: 0.04 }], loft(600)).uValue;
    const two = loftCombinedMethod(
      [
        { thicknessMm: 100, lambda: 0.04 },
        { thicknessMm: 150, lambda: 0.04 },
      ],
      loft(600),
    ).uValue;
    expect(one).toBeCloseTo(two, 12);
  });

  it('never rises as insulation is added', () => {
    let last = Infinity;
    for (let d = 0; d <= 500; d += 10) {
      const u = loftCombinedMethod(d ? [{ thicknessMm: d, lambda: 0.044 }] : [], loft(400)).uValue;
      expect(u).toBeLessThanOrEqual(last + 1e-12);
      last = u;
    }
  });

  it('finds the depth that reaches a target U-value (Approved Document L 2021 Table 4.3 improved value 0.16; memory agrees)', () => {
    const base = [{ thicknessMm: 100, lambda: 0.044 }];
    const d = depthForTargetU(base, 0.044, 0.16, loft(400))!;
    expect(loftCombinedMethod([...base, { thicknessMm: d, lambda: 0.044 }], loft(400)).uValue).toBeLessThanOrEqual(0.16);
    expect(loftCombinedMethod([...base, { thicknessMm: d - 1, lambda: 0.044 }], loft(400)).uValue).toBeGreaterThan(0.16);
    expect(depthForTargetU(base, 0.044, 2, loft(400))).toBe(0);
    expect(depthForTargetU(base, 0.044, 0.005, loft(400))).toBeNull();
  });
});

describe('RdSAP 2012 Table S9 (SAP 2012 Appendix S, v9.94, 2019; found)', () => {
  it.each([
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
    [500, 0.11],
  ])('looks up %s mm as %s W/m²K', (mm, u) => {
    expect(rdsapRoofUValue(mm)).toBe(u);
  });

  it('takes the row at or below a depth between rows (Quiltline convention)', () => {
    expect(rdsapRoofUValue(120)).toBe(0.4);
    expect(rdsapRoofUValue(269)).toBe(0.17);
  });

  it('agrees with the combined method within 10% from 50 mm up (λ 0.044, joists 47 mm at 600 mm)', () => {
    for (const [mm, table] of RDSAP_S9_ROOF_U) {
      if (mm < 50) continue;
      const u = loftCombinedMethod([{ thicknessMm: mm, lambda: 0.044 }], loft(600)).uValue;
      expect(Math.abs(u - table) / table).toBeLessThanOrEqual(0.1);
    }
  });
});

describe('imperial R-values (factor 5.678263, found in public code)', () => {
  it.each([
    [30, 5.283],
    [38, 6.692],
    [49, 8.629],
    [60, 10.567],
  ])('R-%s is %s m²K/W (US IECC ceiling values, found)', (rIp, rSi) => {
    expect(rValueImperial(rSi)).toBeCloseTo(rIp, 1);
    expect(rIp / R_SI_TO_IP).toBeCloseTo(rSi, 3);
  });
});

describe('yearly saving (degree-day method, standard formula from memory)', () => {
  it('matches the hand-worked formula: ΔU 0.40 → 0.16, 50 m², 2,462 K·day, η 0.85', () => {
    const s = yearlySavings(0.4, 0.16, 50, 2462, 0.85, 6.5);
    expect(Math.abs(s.heatKwhPerYear - 709.1)).toBeLessThanOrEqual(0.5);
    expect(Math.abs(s.fuelKwhPerYear - 834.2)).toBeLessThanOrEqual(0.5);
    expect(s.moneyMinorPerYear).toBe(Math.round((709.056 / 0.85) * 6.5));
  });

  it('saves nothing when the U-value does not fall, and has no payback then', () => {
    expect(yearlySavings(0.16, 0.2, 50, 2462, 0.85, 6.5).heatKwhPerYear).toBe(0);
    expect(paybackYears(100_000, 0)).toBeNull();
    expect(paybackYears(100_000, 25_000)).toBe(4);
  });

  it('uses the sourced defaults', () => {
    expect(DEFAULT_TAKEOFF_SETTINGS).toMatchObject({
      degreeDays: 2462,
      heatingEfficiency: 0.85,
      rsi: 0.1,
      rse: 0.04,
      roofSpaceResistance: 0.2,
      wasteAllowancePct: 10,
    });
  });
});
