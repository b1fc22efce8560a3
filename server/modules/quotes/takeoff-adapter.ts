import { planSchema } from '../../../shared/plan/plan-schema';
import type { CompanySettings, Product } from '../../../shared/api/settings';
import type { SpaceForQuote } from '../../../shared/quote/build-lines';
import { computeTakeoff, type Takeoff } from '../../../shared/takeoff/compute-takeoff';
import { parseProductCatalogue } from '../../../shared/takeoff/products';
import { isTakeoff, takeoffSettingsOf } from '../plans/plans.takeoff';

export type SpaceTakeoff =
  | {
      ok: true;
      takeoff: Takeoff;
      space: SpaceForQuote;
      netAreaM2: number;
      uBefore: number;
      uAfter: number;
      saving: { kwh: number; minor: number } | null;
      layerNames: string[];
      warnings: string[];
    }
  | { ok: false; message: string };

/** The takeoff of a space's plan with the company's catalogue and settings; throws the plan's own messages. */
export function computeSpaceTakeoff(planRaw: unknown, products: Product[], settings: CompanySettings): Takeoff {
  const parsed = planSchema.safeParse(planRaw);
  if (!parsed.success) throw new Error(`the saved plan does not read as a plan: ${parsed.error.issues[0]?.message ?? 'unknown problem'}`);
  return computeTakeoff(parsed.data, { products: parseProductCatalogue(products), settings: takeoffSettingsOf(settings) });
}

/**
 * What the quote needs from one space: the takeoff saved with the plan revision when there is one,
 * otherwise computed now from the plan with the company's catalogue and settings.
 */
export function takeoffForSpace(name: string, planRaw: unknown, stored: unknown, products: Product[], settings: CompanySettings): SpaceTakeoff {
  let takeoff: Takeoff;
  try {
    takeoff = isTakeoff(stored) ? stored : computeSpaceTakeoff(planRaw, products, settings);
  } catch (e) {
    const err = e as Error & { errors?: Array<{ message: string }> };
    const detail = Array.isArray(err.errors) ? err.errors.map((i) => i.message).join('; ') : err.message;
    return { ok: false, message: `the takeoff could not be worked out (${detail})` };
  }
  const plan = planRaw as { joists?: { centresMm?: number } };
  const space: SpaceForQuote = {
    spaceName: name,
    layers: takeoff.layers.map((l) => ({
      role: l.role,
      productId: l.productId,
      productName: l.productName,
      areaM2: l.areaM2,
      rollsByPacking: l.rollsByPacking,
      rollsByArea: l.rollsByArea,
    })),
    exclusionCounts: { ...takeoff.exclusions.countsByKind },
    boardedAreaM2: takeoff.exclusions.boardedAreaM2 ?? 0,
    eavesLengthMm: takeoff.eaves.totalLengthMm ?? 0,
    rafterCentresMm: plan.joists?.centresMm ?? 400,
    yearlySaving: { kwh: takeoff.savings.fuelKwhPerYear, minor: takeoff.savings.moneyMinorPerYear },
  };
  return {
    ok: true,
    takeoff,
    space,
    netAreaM2: takeoff.netAreaM2,
    uBefore: takeoff.uValueBefore,
    uAfter: takeoff.uValueAfter,
    saving: takeoff.savings.moneyMinorPerYear > 0 ? { kwh: takeoff.savings.fuelKwhPerYear, minor: takeoff.savings.moneyMinorPerYear } : null,
    layerNames: takeoff.layers.map((l) => `${l.role === 'base' ? 'between joists' : 'across joists'}: ${l.productName}`),
    warnings: takeoff.warnings.map((w) => w.message),
  };
}
