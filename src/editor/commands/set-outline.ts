import type { Plan } from '../../../shared/plan/plan-schema';
import { checkPoint } from './command';

/** Replaces the outline's corners (mm); eaves marks are cleared because the edges are new. */
export function setOutline(plan: Plan, args: { outline: ReadonlyArray<readonly [number, number]> }): Plan {
  return { ...plan, outline: args.outline.map((p) => checkPoint(p, 'corner')), eavesEdges: [] };
}
