import { planSchema, type Plan } from '../../shared/plan/plan-schema';

/** An 8400 × 5200 rectangle with a tank and a downlight, eaves on the long sides. */
export function rectPlan(): Plan {
  return planSchema.parse({
    format: 'quiltline-plan/1',
    name: 'Test loft',
    outline: [
      [0, 0],
      [8400, 0],
      [8400, 5200],
      [0, 5200],
    ],
    eavesEdges: [0, 2],
    eavesGapMm: 50,
    joists: { angleDeg: 90, centresMm: 400, widthMm: 47, depthMm: 100, offsetMm: 0 },
    exclusions: [
      {
        kind: 'tank',
        label: 'cold water tank',
        polygon: [
          [500, 500],
          [1700, 500],
          [1700, 1400],
          [500, 1400],
        ],
      },
      { kind: 'downlight', at: [4200, 2600] },
    ],
    existing: { depthMm: 100, condition: 'good' },
    target: { depthMm: 270 },
  });
}

export function emptyPlan(): Plan {
  return planSchema.parse({
    format: 'quiltline-plan/1',
    name: 'New loft',
    outline: [],
    joists: { angleDeg: 90, centresMm: 400, widthMm: 47, depthMm: 100 },
  });
}
