import type { Plan } from '../../../shared/plan/plan-schema';
import { checkIndex } from './command';

/** Marks outline edge `edge` as an eaves edge, or unmarks it if it already is one. */
export function toggleEaves(plan: Plan, args: { edge: number }): Plan {
  checkIndex(args.edge, plan.outline.length, 'edge');
  const has = plan.eavesEdges.includes(args.edge);
  const eavesEdges = has ? plan.eavesEdges.filter((e) => e !== args.edge) : [...plan.eavesEdges, args.edge].sort((a, b) => a - b);
  return { ...plan, eavesEdges };
}
