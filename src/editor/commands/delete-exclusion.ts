import type { Plan } from '../../../shared/plan/plan-schema';
import { checkIndex } from './command';

/** Removes exclusion `index`. */
export function deleteExclusion(plan: Plan, args: { index: number }): Plan {
  checkIndex(args.index, plan.exclusions.length, 'exclusion');
  return { ...plan, exclusions: plan.exclusions.filter((_, k) => k !== args.index) };
}
