import type { PlanMessage } from '../../../shared/plan/plan-messages';
import { validatePlanShape } from '../../../shared/plan/validate-plan';
import { AppError, ValidationError, type ErrorDetail } from '../errors';
import { PlanPoolBusyError, PlanTimeoutError, type PlanPool, type PlanTask, type PlanTaskResult } from './index';

/** A plan message as an error detail, `path` naming the field under `plan.` (`plan.joists.centresMm`). */
export function messageDetail(m: PlanMessage): ErrorDetail {
  const where =
    m.path ??
    (m.edgeIndex !== undefined
      ? `outline.edge.${m.edgeIndex}`
      : m.pointIndex !== undefined
        ? `outline.${m.pointIndex}`
        : m.exclusionIndex !== undefined
          ? `exclusions.${m.exclusionIndex}`
          : '');
  return { path: where ? `plan.${where}` : 'plan', message: m.message };
}

/** The 422 for a plan the engine refuses, with every message. */
export function invalidPlan(errors: PlanMessage[]): ValidationError {
  return new ValidationError(errors.map(messageDetail), `the plan is not valid: ${errors.map((e) => e.message).join('; ')}`);
}

/**
 * Format, sizes and schema on this thread (cheap: sizes are bounded before parsing); 422 when they
 * fail. Callers run it before any other work, so most bad plans cost neither a query nor a worker.
 */
export function checkPlanShapeOr422(plan: unknown): void {
  const shape = validatePlanShape(plan);
  if (!shape.ok) throw invalidPlan(shape.errors);
}

/**
 * Runs a plan check or takeoff in the worker pool, the one way every path that stores a plan
 * (save, restore, a new space's first plan) checks it. A refused plan is a 422 naming the fields;
 * one past the time limit a 422 `plan_too_complex`; a full queue a 503 to retry.
 */
export async function runPlanTaskOr422(pool: PlanPool, task: PlanTask): Promise<Extract<PlanTaskResult, { ok: true }>> {
  checkPlanShapeOr422(task.plan);
  let r: PlanTaskResult;
  try {
    r = await pool.run(task);
  } catch (e) {
    if (e instanceof PlanTimeoutError) {
      throw new AppError(422, 'plan_too_complex', `${e.message}: simplify the outline or exclusions, or check the joist centres`, [
        { path: 'plan', message: e.message },
      ]);
    }
    if (e instanceof PlanPoolBusyError || (e instanceof Error && e.name === 'AbortError')) {
      // A full queue, or the pool closing under the task (the server is stopping).
      throw new AppError(503, 'busy', 'the takeoff workers are busy; try again in a moment');
    }
    throw e;
  }
  if (!r.ok) throw invalidPlan(r.errors);
  return r;
}
