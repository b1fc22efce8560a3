// Oversized and at-the-limit plans for the plan-size tests (shared and API).
import { PLAN_FORMAT } from '../../../shared/plan/plan-schema';
import { PLAN_LIMITS } from '../../../shared/plan/plan-limits';

const base = {
  format: PLAN_FORMAT,
  name: 'Big loft',
  eavesEdges: [],
  existing: { depthMm: 0, condition: 'none' },
  target: { depthMm: 270 },
};

/** The plan of the report: a 99 m square outline with joist centres of 0.4 mm and width 0.2 mm (346 bytes). */
export function tinyCentresPlan() {
  return {
    ...base,
    outline: [
      [0, 0],
      [99_000, 0],
      [99_000, 99_000],
      [0, 99_000],
    ],
    joists: { angleDeg: 90, centresMm: 0.4, widthMm: 0.2, depthMm: 100 },
    exclusions: [
      {
        kind: 'hatch',
        polygon: [
          [1000, 1000],
          [1600, 1000],
          [1600, 1600],
          [1000, 1600],
        ],
      },
    ],
  };
}

/** A regular polygon of `corners` corners, radius `r` mm, centred at (cx, cy). */
export function ring(corners: number, r: number, cx = 0, cy = 0): [number, number][] {
  return Array.from({ length: corners }, (_, i) => {
    const a = (2 * Math.PI * i) / corners;
    return [Math.round((cx + r * Math.cos(a)) * 1000) / 1000, Math.round((cy + r * Math.sin(a)) * 1000) / 1000] as [number, number];
  });
}

/** An outline of `corners` corners (a 30 m circle) at 400 mm centres, with one hatch. */
export function manyCornersPlan(corners: number) {
  return { ...base, outline: ring(corners, 15_000), joists: { angleDeg: 90, centresMm: 400, widthMm: 47, depthMm: 100 }, exclusions: [] };
}

/** A 12 m × 10 m loft with `count` downlights on a grid. */
export function manyDownlightsPlan(count: number) {
  const exclusions = Array.from({ length: count }, (_, i) => ({
    kind: 'downlight',
    at: [200 + (i % 100) * 116, 200 + (Math.floor(i / 100) * 9_500) / Math.ceil(count / 100)],
  }));
  return {
    ...base,
    outline: [
      [0, 0],
      [12_000, 0],
      [12_000, 10_000],
      [0, 10_000],
    ],
    joists: { angleDeg: 90, centresMm: 400, widthMm: 47, depthMm: 100 },
    exclusions,
  };
}

/**
 * A plan at every limit at once: an outline of `PLAN_LIMITS.outlineCorners` corners spanning
 * 60 m, joist centres giving just under `PLAN_LIMITS.bays` bays, `PLAN_LIMITS.exclusions`
 * exclusions of which some are polygons with `PLAN_LIMITS.allExclusionCorners` corners together.
 */
export function planAtTheLimits() {
  const r = 30_000;
  const outline = ring(PLAN_LIMITS.outlineCorners, r);
  const centresMm = Math.ceil((2 * r) / (PLAN_LIMITS.bays - 2));
  const polygons = Math.floor(PLAN_LIMITS.allExclusionCorners / PLAN_LIMITS.exclusionCorners);
  const exclusions: Array<Record<string, unknown>> = [];
  for (let i = 0; i < polygons; i++) {
    const a = (2 * Math.PI * i) / polygons;
    exclusions.push({ kind: i === 0 ? 'hatch' : 'tank', polygon: ring(PLAN_LIMITS.exclusionCorners, 600, 18_000 * Math.cos(a), 18_000 * Math.sin(a)) });
  }
  for (let i = exclusions.length; i < PLAN_LIMITS.exclusions; i++) {
    const k = i - polygons;
    exclusions.push({ kind: 'downlight', at: [-8_000 + (k % 24) * 700, -8_000 + Math.floor(k / 24) * 700] });
  }
  return { ...base, outline, joists: { angleDeg: 90, centresMm, widthMm: 47, depthMm: 100 }, exclusions };
}
