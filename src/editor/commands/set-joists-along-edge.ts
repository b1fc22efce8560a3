import type { Plan } from '../../../shared/plan/plan-schema';
import { CommandError, checkIndex } from './command';
import { round3 } from '../geometry/coords';

/** Turns the joists to run parallel to outline edge `edge`. */
export function setJoistsAlongEdge(plan: Plan, args: { edge: number }): Plan {
  const n = plan.outline.length;
  checkIndex(args.edge, n, 'edge');
  const a = plan.outline[args.edge];
  const b = plan.outline[(args.edge + 1) % n];
  if (a[0] === b[0] && a[1] === b[1]) throw new CommandError(`edge ${args.edge + 1} has no length, so no direction`);
  const deg = (Math.atan2(b[1] - a[1], b[0] - a[0]) * 180) / Math.PI;
  return { ...plan, joists: { ...plan.joists, angleDeg: round3(((deg % 180) + 180) % 180) } };
}
