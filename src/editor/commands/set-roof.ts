import { roofSchema, type Plan } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';
import type { z } from 'zod';

type Roof = z.infer<typeof roofSchema>;

/** Drops undefined keys, and the whole record when nothing is left, so an empty choice leaves no trace in the file. */
export function compact<T extends object>(o: T): T | undefined {
  const out = Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as T;
  return Object.keys(out).length ? out : undefined;
}

/** Updates the roof notes (shape, pitch °, rafter centres mm); a key set to undefined is cleared. */
export function setRoof(plan: Plan, args: Partial<Roof>): Plan {
  const parsed = roofSchema.safeParse(compact({ ...plan.roof, ...args }) ?? {});
  if (!parsed.success) throw new CommandError(`roof ${parsed.error.issues[0]?.path.join('.')}: ${parsed.error.issues[0]?.message}`);
  const { roof: _old, ...rest } = plan;
  const roof = compact(parsed.data);
  return roof ? { ...rest, roof } : rest;
}
