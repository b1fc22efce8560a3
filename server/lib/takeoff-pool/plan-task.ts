import { InvalidPlanError, type PlanMessage } from '../../../shared/plan/plan-messages';
import type { Plan } from '../../../shared/plan/plan-schema';
import { validatePlan } from '../../../shared/plan/validate-plan';
import type { Takeoff } from '../../../shared/takeoff/takeoff-types';
import { computePlanTakeoff, type TakeoffInputs } from '../../modules/plan-revisions/compute-plan-takeoff';

/** What a pool worker is asked: check a raw plan, or check it and compute its takeoff. */
export type PlanTask = { kind: 'validate'; plan: unknown } | ({ kind: 'takeoff'; plan: unknown } & TakeoffInputs);

/** A worker's answer; errors travel as messages because Error subclasses do not cross threads. */
export type PlanTaskResult = { ok: true; plan: Plan; warnings: PlanMessage[]; takeoff?: Takeoff } | { ok: false; errors: PlanMessage[] };

/**
 * Runs one task (in a worker thread, or inline where no pool is wanted): validatePlan, then the
 * one takeoff function of stored revisions (computePlanTakeoff). Pure apart from CPU.
 */
export function runPlanTask(task: PlanTask): PlanTaskResult {
  const v = validatePlan(task.plan);
  if (!v.ok) return { ok: false, errors: v.errors };
  if (task.kind === 'validate') return { ok: true, plan: v.plan, warnings: v.warnings };
  try {
    return { ok: true, plan: v.plan, warnings: v.warnings, takeoff: computePlanTakeoff(v.plan, task) };
  } catch (e) {
    if (e instanceof InvalidPlanError) return { ok: false, errors: e.errors };
    throw e;
  }
}
