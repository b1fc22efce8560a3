import { siteNotesSchema, type Plan } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';
import { compact } from './set-roof';
import type { z } from 'zod';

type SiteNotes = z.infer<typeof siteNotesSchema>;

/** Updates the surveyor's site notes (extract-fan ducts, low-voltage downlights, water pipes); a key set to undefined is cleared. */
export function setSiteNotes(plan: Plan, args: Partial<SiteNotes>): Plan {
  const parsed = siteNotesSchema.safeParse(compact({ ...plan.site, ...args }) ?? {});
  if (!parsed.success) throw new CommandError(`site notes ${parsed.error.issues[0]?.path.join('.')}: ${parsed.error.issues[0]?.message}`);
  const { site: _old, ...rest } = plan;
  const site = compact(parsed.data);
  return site ? { ...rest, site } : rest;
}
