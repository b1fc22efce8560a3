import { EXCLUSION_KINDS, type ExclusionKind, type Plan } from '../../../shared/plan/plan-schema';
import { CommandError, checkIndex } from './command';

/** Changes the kind of exclusion `index` (a point stays a point, an area an area); a boards choice goes when it stops being a boarded area. */
export function setExclusionKind(plan: Plan, args: { index: number; kind: ExclusionKind }): Plan {
  checkIndex(args.index, plan.exclusions.length, 'exclusion');
  if (!EXCLUSION_KINDS.includes(args.kind)) throw new CommandError(`"${args.kind}" is not an exclusion kind`);
  const exclusions = plan.exclusions.slice();
  const { boards, ...rest } = exclusions[args.index];
  exclusions[args.index] = args.kind === 'boarded' && boards ? { ...rest, kind: args.kind, boards } : { ...rest, kind: args.kind };
  return { ...plan, exclusions };
}
