import { exclusionSchema, type Exclusion, type Plan } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';

/** Adds an exclusion (a polygon or a point) after checking it against the plan schema. */
export function addExclusion(plan: Plan, args: { exclusion: Exclusion }): Plan {
  const parsed = exclusionSchema.safeParse(args.exclusion);
  if (!parsed.success) throw new CommandError(parsed.error.issues[0]?.message ?? 'not a valid exclusion');
  return { ...plan, exclusions: [...plan.exclusions, parsed.data] };
}
