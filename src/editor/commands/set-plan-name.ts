import type { Plan } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';

/** Renames the plan (1–120 characters). */
export function setPlanName(plan: Plan, args: { name: string }): Plan {
  const name = args.name.trim();
  if (!name || name.length > 120) throw new CommandError('a plan name is 1 to 120 characters');
  return { ...plan, name };
}
