import { planSchema, type Plan } from '../../../shared/plan/plan-schema';

/** Unsaved edits kept in the browser, so a reload or a crash loses nothing. */
export type PlanDraft = { plan: Plan; baseRevision: number; savedAt: string };

const key = (spaceId: string) => `quiltline.plan-draft.${spaceId}`;

export function readDraft(spaceId: string): PlanDraft | null {
  try {
    const raw = localStorage.getItem(key(spaceId));
    if (!raw) return null;
    const d = JSON.parse(raw) as PlanDraft;
    const parsed = planSchema.safeParse(d.plan);
    if (!parsed.success || typeof d.baseRevision !== 'number') return null;
    return { plan: parsed.data, baseRevision: d.baseRevision, savedAt: String(d.savedAt) };
  } catch {
    return null;
  }
}

export function writeDraft(spaceId: string, draft: PlanDraft): void {
  try {
    localStorage.setItem(key(spaceId), JSON.stringify(draft));
  } catch {
    // Storage full or disabled: the explicit save still works; nothing else to do here.
  }
}

export function clearDraft(spaceId: string): void {
  try {
    localStorage.removeItem(key(spaceId));
  } catch {
    // ignore, as above
  }
}

/** Whether two plans are the same document (key order aside). */
export function samePlan(a: Plan, b: Plan): boolean {
  return JSON.stringify(planSchema.parse(a)) === JSON.stringify(planSchema.parse(b));
}
