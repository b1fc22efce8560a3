import type { Plan } from '../../../shared/plan/plan-schema';
import { checkIndex, checkPoint } from './command';

/**
 * Splits edge `edge` by inserting a corner at `at`. Later edges shift up by one; an eaves edge
 * that is split stays eaves on both halves.
 */
export function insertCorner(plan: Plan, args: { edge: number; at: readonly [number, number] }): Plan {
  checkIndex(args.edge, plan.outline.length, 'edge');
  const outline = plan.outline.slice();
  outline.splice(args.edge + 1, 0, checkPoint(args.at, 'corner'));
  const eavesEdges: number[] = [];
  for (const e of plan.eavesEdges) {
    if (e < args.edge) eavesEdges.push(e);
    else if (e === args.edge) eavesEdges.push(e, e + 1);
    else eavesEdges.push(e + 1);
  }
  return { ...plan, outline, eavesEdges };
}
