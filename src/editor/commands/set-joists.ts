import type { Joists, Plan } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';

/** Changes any of the joists' angle, centres, width, depth or offset (mm, degrees). */
export function setJoists(plan: Plan, args: Partial<Joists>): Plan {
  const joists = { ...plan.joists, ...args };
  if (!(joists.centresMm > 0)) throw new CommandError('joist centres must be more than 0 mm');
  if (!(joists.widthMm > 0) || joists.widthMm >= joists.centresMm) {
    throw new CommandError('joist width must be more than 0 mm and less than the centres');
  }
  if (!(joists.depthMm > 0)) throw new CommandError('joist depth must be more than 0 mm');
  if (!Number.isFinite(joists.angleDeg)) throw new CommandError('the joist angle must be a number of degrees');
  joists.angleDeg = ((joists.angleDeg % 180) + 180) % 180;
  return { ...plan, joists };
}
