import type { Plan } from '../../../shared/plan/plan-schema';
import { checkIndex } from './command';
import { round3 } from '../geometry/coords';

/** Moves exclusion `index` by (dx, dy) mm. */
export function moveExclusion(plan: Plan, args: { index: number; dx: number; dy: number }): Plan {
  checkIndex(args.index, plan.exclusions.length, 'exclusion');
  const shift = (p: [number, number]): [number, number] => [round3(p[0] + args.dx), round3(p[1] + args.dy)];
  const exclusions = plan.exclusions.slice();
  const e = exclusions[args.index];
  exclusions[args.index] = e.polygon ? { ...e, polygon: e.polygon.map(shift) } : { ...e, at: shift(e.at!) };
  return { ...plan, exclusions };
}
