import type { Plan } from '../../../shared/plan/plan-schema';
import { CommandError, checkIndex } from './command';
import { round3 } from '../geometry/coords';

/**
 * Sets the length of edge `edge` (from corner `edge` to the next) by moving its end corner along
 * the edge's own direction; the next edge stretches to meet it. Lengths in mm.
 */
export function setEdgeLength(plan: Plan, args: { edge: number; lengthMm: number }): Plan {
  const n = plan.outline.length;
  checkIndex(args.edge, n, 'edge');
  if (!(args.lengthMm > 0) || !Number.isFinite(args.lengthMm)) throw new CommandError('an edge length must be a positive number of mm');
  const a = plan.outline[args.edge];
  const j = (args.edge + 1) % n;
  const b = plan.outline[j];
  const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
  if (len === 0) throw new CommandError(`edge ${args.edge + 1} has no length, so no direction to stretch along`);
  const k = args.lengthMm / len;
  const outline = plan.outline.slice();
  outline[j] = [round3(a[0] + (b[0] - a[0]) * k), round3(a[1] + (b[1] - a[1]) * k)];
  return { ...plan, outline };
}
