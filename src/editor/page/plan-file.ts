import type { Plan } from '../../../shared/plan/plan-schema';

/** Downloads the plan as a `quiltline-plan/1` JSON file. */
export function exportPlanFile(plan: Plan): void {
  const blob = new Blob([JSON.stringify(plan, null, 2) + '\n'], { type: 'application/json' });
  const a = document.createElement('a');
  a.href = URL.createObjectURL(blob);
  a.download = `${plan.name.replace(/[^\w.-]+/g, '-').replace(/^-+|-+$/g, '') || 'plan'}.quiltline.json`;
  document.body.appendChild(a);
  a.click();
  a.remove();
  setTimeout(() => URL.revokeObjectURL(a.href), 1000);
}

/** Reads a chosen file as JSON; a clear error when it is not JSON (the schema check comes after). */
export async function readPlanFile(file: File): Promise<unknown> {
  if (file.size > 5 * 1024 * 1024) throw new Error('that file is larger than 5 MB: a plan file is much smaller');
  const text = await file.text();
  try {
    return JSON.parse(text);
  } catch {
    throw new Error(`${file.name} is not a JSON file`);
  }
}
