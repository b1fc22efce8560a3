import type { Plan } from '../../../shared/plan/plan-schema';
import { checkIndex } from './command';

/**
 * Removes corner `index`; the two edges meeting there become one, which is eaves if the edge
 * before the corner was. Later edges shift down by one.
 */
export function deleteCorner(plan: Plan, args: { index: number }): Plan {
  const n = plan.outline.length;
  checkIndex(args.index, n, 'corner');
  const i = args.index;
  const outline = plan.outline.filter((_, k) => k !== i);
  // Edge i (leaving the deleted corner) merges into edge i-1 (for i = 0, into the new last edge,
  // which is old edge n-1 shifted down), so it survives only through that edge's own mark.
  const eavesEdges = plan.eavesEdges.filter((e) => e !== i && e < n).map((e) => (e < i ? e : e - 1));
  return { ...plan, outline, eavesEdges };
}
