import { planSchema, type Plan, type PlanInput } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';

/** Replaces the whole plan (import, restore a revision, load theirs) after checking the schema. */
export function replacePlan(_plan: Plan, args: { plan: PlanInput | Plan }): Plan {
  const parsed = planSchema.safeParse(args.plan);
  if (!parsed.success) {
    const i = parsed.error.issues[0];
    throw new CommandError(`not a Quiltline plan: ${i?.path.join('.') || 'file'}: ${i?.message}`);
  }
  return parsed.data;
}
