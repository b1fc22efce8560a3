import type { Joists, Plan } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';

/**
 * Changes any of the joists' angle, centres, width, depth or offset (mm, degrees). A refusal names
 * the value that was typed: centres of 40 mm beside 47 mm joists is a centres problem, not a width
 * one, even though the rule (centres above width) involves both.
 */
export function setJoists(plan: Plan, args: Partial<Joists>): Plan {
  const joists = { ...plan.joists, ...args };
  if (!(joists.centresMm > 0)) throw new CommandError('joist centres must be more than 0 mm');
  if (!(joists.widthMm > 0)) throw new CommandError('joist width must be more than 0 mm');
  if (joists.widthMm >= joists.centresMm) {
    throw new CommandError(
      args.centresMm !== undefined && args.widthMm === undefined
        ? `joist centres of ${joists.centresMm} mm must be more than the joist width (${joists.widthMm} mm): centres are measured from the middle of one joist to the middle of the next`
        : `joist width of ${joists.widthMm} mm must be less than the joist centres (${joists.centresMm} mm)`,
    );
  }
  if (!(joists.depthMm > 0)) throw new CommandError('joist depth must be more than 0 mm');
  if (!Number.isFinite(joists.angleDeg)) throw new CommandError('the joist angle must be a number of degrees');
  joists.angleDeg = ((joists.angleDeg % 180) + 180) % 180;
  return { ...plan, joists };
}
