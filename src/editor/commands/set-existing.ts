import { existingSchema, type Existing, type Plan } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';

/**
 * Records the existing insulation (depth mm, condition, optional λ). Depth and condition are kept
 * consistent, so a typed depth is never silently counted as nothing: a depth typed over the
 * condition "none" takes the condition "good" (the estimator can change it), a depth of 0 takes
 * "none", and choosing "none" clears the depth.
 */
export function setExisting(plan: Plan, args: Partial<Existing>): Plan {
  const next = { ...plan.existing, ...args };
  if (args.condition === undefined && args.depthMm !== undefined) {
    if (args.depthMm > 0 && next.condition === 'none') next.condition = 'good';
    if (args.depthMm === 0) next.condition = 'none';
  }
  if (args.condition === 'none' && args.depthMm === undefined) next.depthMm = 0;
  const parsed = existingSchema.safeParse(next);
  if (!parsed.success) throw new CommandError(`existing insulation: ${parsed.error.issues[0]?.message}`);
  return { ...plan, existing: parsed.data };
}
