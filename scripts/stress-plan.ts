import type { PlanInput } from '../shared/plan/plan-schema';
import { mulberry32 } from './mulberry32';

/**
 * A generated stress plan for the takeoff benchmark: a wavy 400-point outline of about 600 m²,
 * 100 exclusions (downlights, tanks, hatches, boards, flues, other) and 400 mm joist centres.
 * Deterministic (mulberry32 seeded PRNG) so runs compare; `angleDeg` turns the joists (skewed plans).
 */
export function stressPlan(seed = 7, points = 400, exclusions = 100, angleDeg = 13): PlanInput {
  const rand = mulberry32(seed);
  const R = 13_700;
  const outline: [number, number][] = [];
  for (let i = 0; i < points; i++) {
    const th = (2 * Math.PI * i) / points;
    const r = R * (1 + 0.06 * Math.sin(7 * th) + 0.02 * Math.sin(23 * th));
    outline.push([Math.round(R + r * Math.cos(th)), Math.round(R + r * Math.sin(th))]);
  }
  const ex: PlanInput['exclusions'] = [];
  const kinds = ['downlight', 'tank', 'boarded', 'flue', 'other', 'hatch'] as const;
  for (let i = 0; i < exclusions; i++) {
    const th = rand() * 2 * Math.PI;
    const d = Math.sqrt(rand()) * R * 0.75;
    const cx = Math.round(R + d * Math.cos(th));
    const cy = Math.round(R + d * Math.sin(th));
    const kind = i === 0 ? 'hatch' : i % 5 === 0 ? kinds[1 + (i % 4)] : 'downlight';
    if (kind === 'downlight') {
      ex!.push({ kind, at: [cx, cy] });
    } else {
      const w = kind === 'flue' ? 150 : 400 + Math.round(rand() * 900);
      const h = kind === 'flue' ? 150 : 400 + Math.round(rand() * 700);
      ex!.push({
        kind,
        polygon: [
          [cx, cy],
          [cx + w, cy],
          [cx + w, cy + h],
          [cx, cy + h],
        ],
      });
    }
  }
  return {
    format: 'quiltline-plan/1',
    name: `Stress plan (${points} points, ${exclusions} exclusions)`,
    outline,
    eavesEdges: Array.from({ length: 50 }, (_, i) => i * 2),
    eavesGapMm: 50,
    joists: { angleDeg, centresMm: 400, widthMm: 47, depthMm: 100, offsetMm: 0 },
    exclusions: ex,
    existing: { depthMm: 0, condition: 'none' },
    target: { depthMm: 270 },
  };
}
