import { backgroundSchema, type Plan } from '../../../shared/plan/plan-schema';
import type { z } from 'zod';
import { CommandError } from './command';

export type Background = z.infer<typeof backgroundSchema>;

/** Sets, changes (a partial update merges) or removes (null) the background underlay. */
export function setBackground(plan: Plan, args: { background: Partial<Background> | null }): Plan {
  if (args.background === null) {
    const { background: _b, ...rest } = plan;
    return rest as Plan;
  }
  const parsed = backgroundSchema.safeParse({ ...plan.background, ...args.background });
  if (!parsed.success) throw new CommandError('background: ' + parsed.error.issues[0]?.message);
  return { ...plan, background: parsed.data };
}
