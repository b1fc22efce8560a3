import { targetSchema, type Plan, type Target } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';

/** Sets the goal: a total depth in mm, or a U-value in W/m²K. */
export function setTarget(plan: Plan, args: { target: Target }): Plan {
  const parsed = targetSchema.safeParse(args.target);
  if (!parsed.success) throw new CommandError('the target is a depth in mm (1–1000) or a U-value (0–5 W/m²K)');
  return { ...plan, target: parsed.data };
}
