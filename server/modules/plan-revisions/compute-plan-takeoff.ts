import type { Plan } from '../../../shared/plan/plan-schema';
import { computeTakeoff } from '../../../shared/takeoff/compute-takeoff';
import type { TakeoffProduct } from '../../../shared/takeoff/products';
import type { TakeoffSettings } from '../../../shared/takeoff/settings';
import type { Takeoff } from '../../../shared/takeoff/takeoff-types';

/** What the takeoff needs besides the plan: the company's active roll products and its settings. */
export type TakeoffInputs = { products: TakeoffProduct[]; settings: Partial<TakeoffSettings> };

/**
 * The takeoff artefact of a parsed plan: the one function every stored revision's takeoff comes
 * from. Throws InvalidPlanError (with the engine's messages) when the geometry cannot be worked out.
 * Pure (no database), so the takeoff worker threads run it too (server/lib/takeoff-pool).
 */
export function computePlanTakeoff(plan: Plan, inputs: TakeoffInputs): Takeoff {
  return computeTakeoff(plan, { products: inputs.products, settings: inputs.settings });
}
