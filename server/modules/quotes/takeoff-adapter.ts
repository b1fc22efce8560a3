import { thermalFactsText } from '../../../shared/takeoff/thermal-text';
import type { SpaceForQuote } from '../../../shared/quote/build-lines';
import { spaceForQuote } from '../../../shared/quote/from-takeoff';
import { readStoredTakeoff } from '../../../shared/takeoff/takeoff-schema';
import type { Takeoff } from '../../../shared/takeoff/takeoff-types';

export type SpaceTakeoff =
  | {
      ok: true;
      takeoff: Takeoff;
      space: SpaceForQuote;
      netAreaM2: number;
      uBefore: number;
      uAfter: number;
      /** The U-values named for documents (ISO 6946 insulated area and whole ceiling, RdSAP default). */
      thermalText: string;
      saving: { kwh: number; minor: number } | null;
      layerNames: string[];
      warnings: string[];
    }
  | { ok: false; message: string };

/**
 * What the quote needs from one space: the takeoff artefact stored with its latest plan revision
 * (never recomputed here, so the quote prices what the estimator saw when saving).
 */
export function takeoffForSpace(name: string, _planRaw: unknown, stored: unknown): SpaceTakeoff {
  const takeoff = readStoredTakeoff(stored);
  if (!takeoff) return { ok: false, message: 'its plan has no takeoff stored yet: open the plan and save it' };
  const space = spaceForQuote(name, takeoff);
  return {
    ok: true,
    takeoff,
    space,
    netAreaM2: takeoff.netAreaM2,
    uBefore: takeoff.uValueBefore,
    uAfter: takeoff.uValueAfter,
    thermalText: thermalFactsText(takeoff),
    saving: takeoff.savings.moneyMinorPerYear > 0 ? { kwh: takeoff.savings.fuelKwhPerYear, minor: takeoff.savings.moneyMinorPerYear } : null,
    layerNames: takeoff.layers.map((l) => `${l.role === 'base' ? 'between joists' : 'across joists'}: ${l.productName}`),
    warnings: takeoff.warnings.map((w) => w.message),
  };
}
