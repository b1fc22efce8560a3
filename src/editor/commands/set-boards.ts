import type { BoardedTreatment, Plan } from '../../../shared/plan/plan-schema';
import { CommandError, checkIndex } from './command';

/** Says whether boarded area `index` has its boards raised and insulated under, or is left boarded. */
export function setBoards(plan: Plan, args: { index: number; boards: BoardedTreatment }): Plan {
  checkIndex(args.index, plan.exclusions.length, 'exclusion');
  const e = plan.exclusions[args.index];
  if (e.kind !== 'boarded') throw new CommandError(`exclusion ${args.index + 1} is a ${e.kind}, not a boarded area: only boards can be raised`);
  if (args.boards !== 'raise' && args.boards !== 'leave') throw new CommandError(`boards: "${String(args.boards)}" is neither raise nor leave`);
  const exclusions = plan.exclusions.slice();
  exclusions[args.index] = { ...e, boards: args.boards };
  return { ...plan, exclusions };
}
