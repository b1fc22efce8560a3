import type { Plan } from '../../../shared/plan/plan-schema';
import { checkPoint } from './command';

/** Appends a corner to the outline (the outline closes back to its first corner by itself). */
export function addCorner(plan: Plan, args: { at: readonly [number, number] }): Plan {
  return { ...plan, outline: [...plan.outline, checkPoint(args.at, 'corner')] };
}
