import type { Plan } from '../../../shared/plan/plan-schema';
import type { PlanMessage } from '../../../shared/plan/plan-messages';
import { validatePlan } from '../../../shared/plan/validate-plan';
import { computeTakeoff, type Takeoff, type TakeoffProduct, type TakeoffSettings } from '../../../shared/takeoff/compute-takeoff';
import { InvalidPlanError } from '../../../shared/plan/plan-messages';

export type TakeoffRun = {
  takeoff: Takeoff | null;
  errors: PlanMessage[];
  warnings: PlanMessage[];
  /** How long the engine took, ms. */
  elapsedMs: number;
};

export type TakeoffInput = { plan: Plan; products: TakeoffProduct[]; settings?: Partial<TakeoffSettings> };

/**
 * The engine on the live plan: validate, then compute. An outline still being drawn (fewer than
 * three corners) is not an error yet, just nothing to compute.
 */
export function runTakeoff({ plan, products, settings }: TakeoffInput): TakeoffRun {
  const t0 = performance.now();
  const done = (r: Omit<TakeoffRun, 'elapsedMs'>): TakeoffRun => ({ ...r, elapsedMs: performance.now() - t0 });
  if (plan.outline.length < 3) return done({ takeoff: null, errors: [], warnings: [] });
  const v = validatePlan(plan);
  if (!v.ok) return done({ takeoff: null, errors: v.errors, warnings: v.warnings });
  try {
    const takeoff = computeTakeoff(v.plan, { products, settings });
    return done({ takeoff, errors: [], warnings: v.warnings });
  } catch (e) {
    if (e instanceof InvalidPlanError) return done({ takeoff: null, errors: e.errors, warnings: v.warnings });
    return done({
      takeoff: null,
      errors: [{ code: 'takeoff.failed', message: `the takeoff could not be computed: ${(e as Error).message}` }],
      warnings: v.warnings,
    });
  }
}
