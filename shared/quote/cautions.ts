import type { ExclusionKind } from '../plan/plan-schema';

/**
 * The cautions a quote states, in plain words, and what the customer must do before the install.
 * They defer to local building regulations, electrical rules and licensed practice.
 */
export interface QuoteCautions {
  cautions: string[];
  customerBeforeInstall: string[];
}

const ALWAYS: string[] = [
  'Loft work is work at height: our installers use proper access and tread only on joists or boards.',
  'Mineral-wool fibres irritate skin, eyes and airways: installers wear gloves, goggles and a disposable mask, and the loft is left clean.',
  'Electrical cables are lifted to lie over the insulation, not buried in it; a qualified electrician should check any damaged wiring.',
  'The ventilation gap at the eaves is kept open so the roof space stays dry.',
  "This work follows local building regulations and the product makers' instructions; where they say otherwise, they prevail.",
];

const BY_KIND: Partial<Record<ExclusionKind, string>> = {
  tank: 'No insulation is laid beneath the cold water tank (the warmth from below keeps it from freezing); the tank and its pipes are lagged instead.',
  downlight: 'Recessed lights get fire-rated covers and are never buried in insulation; older fittings may need an electrician to replace them.',
  flue: 'A clearance is kept around flues as the appliance maker and the regulations on heat-producing appliances require.',
  chimney: 'A clearance is kept around the chimney breast.',
  boarded: 'Insulation is never squashed under boards: boarded areas are raised on legs or left as they are.',
  hatch: 'The loft hatch is insulated and draught-sealed so warm, moist air does not leak into the loft.',
};

const BEFORE: string[] = [
  'Clear the loft of stored belongings, or tell us which areas stay boarded and used for storage.',
  'Make sure we can reach the loft hatch and a power socket, and move anything fragile from the landing below.',
  'Tell us about any known problems: damp, roof leaks, pests, damaged wiring or a hatch that sticks.',
];

/** The cautions and the customer's to-do list for a job with these exclusion kinds. */
export function quoteCautions(kinds: Iterable<ExclusionKind>): QuoteCautions {
  const set = new Set(kinds);
  const cautions = [...ALWAYS];
  for (const k of ['tank', 'downlight', 'flue', 'chimney', 'boarded', 'hatch'] as const) {
    if (set.has(k) && BY_KIND[k]) cautions.push(BY_KIND[k]!);
  }
  const before = [...BEFORE];
  if (set.has('downlight')) before.push('If you know the make of your recessed lights, tell us so we fit the right covers.');
  return { cautions, customerBeforeInstall: before };
}
