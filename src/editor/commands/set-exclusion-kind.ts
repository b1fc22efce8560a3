import { EXCLUSION_KINDS, type ExclusionKind, type Plan } from '../../../shared/plan/plan-schema';
import { CommandError, checkIndex } from './command';

/** Changes the kind of exclusion `index` (a point stays a point, an area an area). */
export function setExclusionKind(plan: Plan, args: { index: number; kind: ExclusionKind }): Plan {
  checkIndex(args.index, plan.exclusions.length, 'exclusion');
  if (!EXCLUSION_KINDS.includes(args.kind)) throw new CommandError(`"${args.kind}" is not an exclusion kind`);
  const exclusions = plan.exclusions.slice();
  exclusions[args.index] = { ...exclusions[args.index], kind: args.kind };
  return { ...plan, exclusions };
}
