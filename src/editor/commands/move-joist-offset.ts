import type { Plan } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';

/**
 * Places the first joist centre `offsetMm` from the origin, measured across the joists; kept in
 * [0, centres) because joists repeat every centres.
 */
export function moveJoistOffset(plan: Plan, args: { offsetMm: number }): Plan {
  if (!Number.isFinite(args.offsetMm)) throw new CommandError('the joist offset must be a number of mm');
  const c = plan.joists.centresMm;
  const offsetMm = Math.round((((args.offsetMm % c) + c) % c) * 1000) / 1000;
  return { ...plan, joists: { ...plan.joists, offsetMm } };
}
