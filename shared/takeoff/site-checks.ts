import type { Plan } from '../plan/plan-schema';
import type { ExclusionKind } from '../plan/plan-schema';

/** A caution raised by the plan, to be ticked by the installer. */
export interface SiteCheck {
  code: string;
  message: string;
  /** How many items it concerns (downlights, tanks…), when it counts something. */
  count?: number;
  /** Exclusions it concerns, by index. */
  exclusionIndices?: number[];
}

/** What the site checks need to know besides the plan. */
export interface SiteCheckContext {
  countsByKind: Record<ExclusionKind, number>;
  clearancesMm: number[];
  eavesLengthMm: number;
  boardedAreaM2: number;
  hasLayers: boolean;
  /** New insulation rises above the joist tops. */
  aboveJoists: boolean;
  /** Exclusions to leave out (wholly outside the outline). */
  ignored?: ReadonlySet<number>;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;

/**
 * Site checks for a plan, each with a stable `code` and a plain message. Sources: BRE BR 262 and
 * BS 5250 (eaves ventilation), UK energy-advice pages (tanks), BS 7671 (cables in insulation),
 * New Zealand EnergyWise (clearances), HSE / Work at Height Regulations 2005 (access), safety
 * leaflets (dust). They are reminders: local building regulations, electrical rules and licensed
 * practice come first, and the last check says so.
 */
export function siteChecksFor(plan: Plan, ctx: SiteCheckContext): SiteCheck[] {
  const out: SiteCheck[] = [];
  const idx = (k: ExclusionKind) => plan.exclusions.flatMap((e, i) => (e.kind === k && !ctx.ignored?.has(i) ? [i] : []));
  const c = ctx.countsByKind;
  out.push({
    code: 'access.work-at-height',
    message:
      'Use a secure ladder and good light; tread only on joists or boards — the ceiling will not take your weight. Loft work is work at height (in Great Britain, the Work at Height Regulations 2005).',
  });
  if (ctx.hasLayers)
    out.push({ code: 'ppe.dust', message: 'Mineral-wool dust irritates skin, eyes and airways: wear gloves, goggles, a disposable mask and long sleeves.' });
  if (plan.eavesEdges.length) {
    out.push({
      code: 'eaves.ventilation-gap',
      message: `Keep the ${plan.eavesGapMm} mm ventilation gap clear along ${plural(plan.eavesEdges.length, 'eaves edge')} (${(ctx.eavesLengthMm / 1000).toFixed(1)} m): do not push insulation into the eaves; fit eaves trays where it would block the air path (BRE BR 262: equivalent to a 50 mm continuous gap).`,
      count: plan.eavesEdges.length,
    });
  } else {
    out.push({
      code: 'eaves.ventilation-gap',
      message: 'No eaves edge is marked: check how the roof space is ventilated (BS 5250) before insulating, and keep any air path from the eaves open.',
    });
  }
  out.push({
    code: 'cables.over-insulation',
    message:
      'Lift cables to lie on top of the insulation, never buried in it: a cable surrounded by insulation for 0.5 m or more carries only half its current (BS 7671). Anything doubtful goes to a qualified electrician.',
  });
  if (c.tank)
    out.push({
      code: 'tank.no-insulation-beneath',
      message: `${plural(c.tank, 'tank')}: never insulate beneath a cold-water tank (warmth from below keeps it from freezing); insulate its top and sides and lag the pipes.`,
      count: c.tank,
      exclusionIndices: idx('tank'),
    });
  if (c.downlight)
    out.push({
      code: 'downlight.covers',
      message: `${plural(c.downlight, 'downlight')}: fit a fire-rated cover over each before insulating over it, or keep 100 mm clear unless the fitting is rated for covering; an electrician checks the fittings.`,
      count: c.downlight,
      exclusionIndices: idx('downlight'),
    });
  for (const kind of ['flue', 'chimney'] as const) {
    if (!c[kind]) continue;
    const ids = idx(kind);
    const clear = Math.max(...ids.map((i) => ctx.clearancesMm[i] ?? 0));
    out.push({
      code: `${kind}.clearance`,
      message: `${plural(c[kind], kind === 'flue' ? 'flue' : 'chimney')}: keep insulation at least ${clear} mm clear (more if the appliance maker or local regulations ask — in England, Approved Document J).`,
      count: c[kind],
      exclusionIndices: ids,
    });
  }
  if (c.boarded)
    out.push({
      code: 'boarded.raise-or-leave',
      message: `${plural(c.boarded, 'boarded area')} (${ctx.boardedAreaM2.toFixed(1)} m²): raise the boards on legs above the new depth, or leave the area; never squash insulation under boards — compressed, it loses much of its effect.`,
      count: c.boarded,
      exclusionIndices: idx('boarded'),
    });
  if (c.hatch)
    out.push({
      code: 'hatch.insulate-and-seal',
      message: 'Insulate the top of the hatch lid and fit a draught seal around the frame.',
      count: c.hatch,
      exclusionIndices: idx('hatch'),
    });
  if (ctx.aboveJoists || c.tank)
    out.push({
      code: 'walkway.boards-span-joists',
      message:
        'Lay walkway boards to the tank and services, long enough to span several joists (at least four) and raised above the insulation, never pressed onto it.',
    });
  if (plan.existing.condition === 'damp')
    out.push({
      code: 'existing.damp',
      message: 'The existing insulation is damp: find and fix the cause (a leak, condensation) and replace wet insulation before laying new.',
    });
  if (c.other)
    out.push({
      code: 'other.check',
      message: `${plural(c.other, 'other exclusion')}: check on site what it is and what clearance it needs.`,
      count: c.other,
      exclusionIndices: idx('other'),
    });
  out.push({
    code: 'local-regulations',
    message: 'These checks are reminders: local building regulations, electrical rules and licensed practice come first.',
  });
  return out;
}
