import type { Plan } from '../plan/plan-schema';
import type { ExclusionKind } from '../plan/plan-schema';
import type { EavesSummary } from './eaves';

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
  /** Boarded area whose boards are raised and insulated under, m² (0 when none). */
  raisedBoardedAreaM2?: number;
  hasLayers: boolean;
  /** New insulation rises above the joist tops. */
  aboveJoists: boolean;
  /** Depth of the finished insulation, mm (what raised boards must clear). */
  finishedDepthMm?: number;
  /** Eaves mode, ventilator count and high-level ventilation (see eavesSummary); gap mode when absent. */
  eaves?: EavesSummary;
  /** Exclusions to leave out (wholly outside the outline). */
  ignored?: ReadonlySet<number>;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
const m = (mm: number) => `${(mm / 1000).toFixed(1)} m`;

/**
 * Site checks for a plan, each with a stable `code` and a plain message, in the order of the
 * work. Asbestos and wildlife are always checked before work starts; the others where the plan or
 * the surveyor's notes call for them. Sources: HSE asbestos guidance and the Control of Asbestos
 * Regulations 2012; Wildlife and Countryside Act 1981 and Conservation of Habitats and Species
 * Regulations 2017; BS 5250:2021 and BRE BR 262 (ventilation, condensation); Approved Document F
 * (extract to outside); BS 7671 (cables in insulation); New Zealand EnergyWise (clearances);
 * HSE / Work at Height Regulations 2005 (access); common practice where marked. They are
 * reminders: local regulations and licensed practice come first, and the last check says so.
 */
export function siteChecksFor(plan: Plan, ctx: SiteCheckContext): SiteCheck[] {
  const out: SiteCheck[] = [];
  const idx = (k: ExclusionKind) => {
    const out: number[] = [];
    plan.exclusions.forEach((e, i) => {
      if (e.kind === k && !ctx.ignored?.has(i)) out.push(i);
    });
    return out;
  };
  const c = ctx.countsByKind;
  const site = plan.site ?? {};
  const old = [c.flue ? plural(c.flue, 'flue') : '', c.tank ? plural(c.tank, 'tank') : ''].filter(Boolean).join(' and ');
  out.push({
    code: 'asbestos.stop-and-test',
    message: `Before work, look for asbestos: loose grey-brown or glittery granular fill (vermiculite), old flue pipes, tanks, boards and lagging in homes built before 2000 may contain it${old ? ` — look closely at the ${old} on this plan` : ''}. If you find any, stop, do not disturb it, and have it sampled and tested; removal is for a licensed contractor (HSE asbestos guidance; Control of Asbestos Regulations 2012).`,
  });
  out.push({
    code: 'wildlife.bats-birds',
    message:
      'Before work, check for bats (droppings, staining, live bats) and nesting birds: both are protected, and disturbing a roost or an active nest is an offence (in Great Britain, the Wildlife and Countryside Act 1981 and the Conservation of Habitats and Species Regulations 2017). If you find them, stop and take advice from the national nature conservation body.',
  });
  out.push({
    code: 'access.work-at-height',
    message:
      'Use a secure ladder and good light; tread only on joists or boards — the ceiling will not take your weight. Loft work is work at height (in Great Britain, the Work at Height Regulations 2005).',
  });
  if (ctx.hasLayers)
    out.push({ code: 'ppe.dust', message: 'Mineral-wool dust irritates skin, eyes and airways: wear gloves, goggles, a disposable mask and long sleeves.' });
  if (ctx.hasLayers)
    out.push({
      code: 'ceiling.seal-holes',
      message:
        'Before insulating, seal gaps around pipes, cables and fittings through the ceiling: warm, moist air through them is the main source of condensation in a cold loft (BS 5250:2021). Around a flue, only with a non-combustible seal its maker allows.',
    });
  const eaves = ctx.eaves;
  if (!plan.eavesEdges.length) {
    out.push({
      code: 'eaves.ventilation-gap',
      message: 'No eaves edge is marked: check how the roof space is ventilated (BS 5250:2021) before insulating, and keep any air path from the eaves open.',
    });
  } else if (eaves?.mode === 'ventilators') {
    out.push({
      code: 'eaves.ventilators',
      message: `Fit ${plural(eaves.ventilatorCount, 'eaves ventilator')} (one per rafter space at ${eaves.rafterCentresMm} mm along ${m(ctx.eavesLengthMm)} of eaves) and run the insulation over the wall plate to meet the wall insulation, so the ceiling edge is not left cold; the ventilators must keep the air path from the eaves open (BS 5250:2021; BRE BR 262: equivalent to a continuous 50 mm gap unless the underlay maker says otherwise).`,
      count: eaves.ventilatorCount,
    });
  } else {
    out.push({
      code: 'eaves.ventilation-gap',
      message: `Keep the ${plan.eavesGapMm} mm ventilation gap clear along ${plural(plan.eavesEdges.length, 'eaves edge')} (${m(ctx.eavesLengthMm)}): do not push insulation into the eaves (BS 5250:2021; BRE BR 262: equivalent to a continuous 50 mm gap). The ceiling edge kept bare is cold and can grow mould: eaves ventilators with the insulation over the wall plate avoid that.`,
      count: plan.eavesEdges.length,
    });
  }
  if (eaves?.highLevel.needed)
    out.push({
      code: 'ventilation.high-level',
      message: `High-level ventilation: ${eaves.highLevel.reasons.join('; ')}. BS 5250:2021 then asks for openings at or near the ridge as well as at the eaves (for a cold pitched roof, equivalent to a continuous 5 mm gap), unless the underlay's certificate says otherwise — have it checked before adding insulation.`,
    });
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
  else if (site.waterPipes !== false)
    out.push({
      code: 'pipes.lagging',
      message:
        'There is no tank on the plan, but any water or heating pipes in the loft end up above the new insulation, in the cold: lag them (and any pipe under the insulation need not be).',
    });
  if (c.downlight) {
    out.push({
      code: 'downlight.covers',
      message: `${plural(c.downlight, 'downlight')}: fit a fire-rated cover over each before insulating over it, or keep 100 mm clear unless the fitting is rated for covering; an electrician checks the fittings.`,
      count: c.downlight,
      exclusionIndices: idx('downlight'),
    });
    if (site.lowVoltageDownlights !== false)
      out.push({
        code: 'downlight.transformers',
        message: `${site.lowVoltageDownlights ? 'The downlights are low-voltage' : 'If any downlight is low-voltage'}: lift each transformer on top of the insulation, never bury it — it overheats (common practice; an electrician checks).`,
        exclusionIndices: idx('downlight'),
      });
  }
  if (site.extractFanDucts)
    out.push({
      code: 'extract.ducts',
      message: `${plural(site.extractFanDucts, 'extract-fan duct')}: check each runs to an outside terminal, not into the loft (Approved Document F; BS 5250:2021), insulate it where it crosses the cold loft so condensate cannot run back, and keep the insulation clear of the fan (200 mm for an unducted fan, New Zealand EnergyWise).`,
      count: site.extractFanDucts,
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
  if (c.boarded) {
    const raised = ctx.raisedBoardedAreaM2 ?? 0;
    const left = Math.max(0, ctx.boardedAreaM2 - raised);
    const parts = [
      raised > 0
        ? `raise ${raised.toFixed(1)} m² of boards on legs so the deck clears the new ${Math.round(ctx.finishedDepthMm ?? 0)} mm, and lay the insulation under them uncompressed (check the legs' rating and what the joists will carry)`
        : '',
      left > 0 ? `${left.toFixed(1)} m² stays boarded and uninsulated (counted so in the whole-ceiling U-value)` : '',
    ].filter(Boolean);
    out.push({
      code: 'boarded.raise-or-leave',
      message: `${plural(c.boarded, 'boarded area')} (${ctx.boardedAreaM2.toFixed(1)} m²): ${parts.join('; ')}. Never squash insulation under boards — compressed, it loses much of its effect.`,
      count: c.boarded,
      exclusionIndices: idx('boarded'),
    });
  }
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
      message: `Lay walkway boards from the hatch to ${c.tank ? 'the tank and services' : 'anything that needs servicing (boiler, aerial, junction boxes)'}, long enough to span several joists (at least four) and raised above the insulation, never pressed onto it.`,
    });
  if (ctx.aboveJoists)
    out.push({
      code: 'access.crawl-boards',
      message:
        'Once the cross layer hides the joists you cannot see where to tread: lay crawl boards across several joists as you go and work back towards the hatch (a foot through the ceiling is the commonest loft accident; common practice).',
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
    message:
      'These checks are reminders: local building regulations, electrical rules and licensed practice come first — asbestos to a licensed contractor, electrics to a qualified electrician, flues and appliances to a registered engineer.',
  });
  return out;
}
