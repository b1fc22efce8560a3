import { existingSchema, type Existing, type Plan } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';

/** Records the existing insulation (depth mm, condition, optional λ). */
export function setExisting(plan: Plan, args: Partial<Existing>): Plan {
  const parsed = existingSchema.safeParse({ ...plan.existing, ...args });
  if (!parsed.success) throw new CommandError(`existing insulation: ${parsed.error.issues[0]?.message}`);
  return { ...plan, existing: parsed.data };
}
