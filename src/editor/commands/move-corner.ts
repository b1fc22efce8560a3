import type { Plan } from '../../../shared/plan/plan-schema';
import { checkIndex, checkPoint } from './command';

/** Moves outline corner `index` to `to` (mm). */
export function moveCorner(plan: Plan, args: { index: number; to: readonly [number, number] }): Plan {
  checkIndex(args.index, plan.outline.length, 'corner');
  const outline = plan.outline.slice();
  outline[args.index] = checkPoint(args.to, 'corner');
  return { ...plan, outline };
}
