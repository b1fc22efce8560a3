import type { Plan } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';

/** Sets the ventilation gap kept clear along eaves edges, mm (0–500). */
export function setEavesGap(plan: Plan, args: { gapMm: number }): Plan {
  if (!Number.isFinite(args.gapMm) || args.gapMm < 0 || args.gapMm > 500) {
    throw new CommandError('the eaves gap must be between 0 and 500 mm');
  }
  return { ...plan, eavesGapMm: args.gapMm };
}
