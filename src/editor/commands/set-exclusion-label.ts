import type { Plan } from '../../../shared/plan/plan-schema';
import { CommandError, checkIndex } from './command';

/** Sets (or, with an empty string, removes) the label of exclusion `index`. */
export function setExclusionLabel(plan: Plan, args: { index: number; label: string }): Plan {
  checkIndex(args.index, plan.exclusions.length, 'exclusion');
  const label = args.label.trim();
  if (label.length > 120) throw new CommandError('a label is at most 120 characters');
  const exclusions = plan.exclusions.slice();
  const { label: _old, ...rest } = exclusions[args.index];
  exclusions[args.index] = label ? { ...rest, label } : rest;
  return { ...plan, exclusions };
}
