import type { SheetCheck, SheetCut, SheetLayer, SheetRoll, SheetSpace, SheetStrip, VanLoad } from '../../../shared/api/job-sheet';
import { EXTRA_KIND_LABELS, type Extra, type ExtraKind, type ExtraRules } from '../../../shared/api/settings';
import type { ExclusionKind } from '../../../shared/plan/plan-schema';
import { extrasFor } from '../../../shared/quote/extras';
import { spaceForQuote } from '../../../shared/quote/from-takeoff';
import { readStoredTakeoff } from '../../../shared/takeoff/takeoff-schema';
import { thermalFactsText } from '../../../shared/takeoff/thermal-text';
import { jobRollsByProduct } from '../../../shared/takeoff/job-roll-plan';
import type { Takeoff, TakeoffLayer } from '../../../shared/takeoff/takeoff-types';
import { latestRevisionsOfJobs } from '../plan-revisions/revisions.repository';

/**
 * The installer's view of stored takeoff artefacts. Every field is copied by name: a takeoff also
 * carries prices (per layer, per product, yearly savings in money) and none of that may reach an installer.
 */

/** What the sheet reads from a space's latest revision. */
export type RevisionRow = { revision: number; plan: unknown; takeoff: unknown };

export const layerKeyOf = (l: Pick<TakeoffLayer, 'role' | 'roleIndex'>) => (l.role === 'base' ? 'base' : `cross${l.roleIndex + 1}`);
const layerLabel = (l: TakeoffLayer) => (l.role === 'base' ? 'Base layer' : `Cross layer ${l.roleIndex + 1}`);

// Short titles for the checks the takeoff raises (shared/takeoff/site-checks.ts); its message is the detail.
const CHECK_TITLES: Record<string, string> = {
  'access.work-at-height': 'Safe access: ladder, light, joists or boards only',
  'ppe.dust': 'PPE worn: gloves, goggles, mask',
  'eaves.ventilation-gap': 'Ventilation gap kept at the eaves',
  'asbestos.stop-and-test': 'No suspected asbestos or vermiculite (or work stopped for testing)',
  'wildlife.bats-birds': 'No bats or nesting birds found (or work stopped)',
  'ceiling.seal-holes': 'Holes through the ceiling sealed',
  'eaves.ventilators': 'Eaves ventilators fitted, insulation over the wall plate',
  'ventilation.high-level': 'High-level ventilation checked',
  'pipes.lagging': 'Loft pipes lagged',
  'downlight.transformers': 'Downlight transformers above the insulation',
  'extract.ducts': 'Extract-fan ducts run outside and insulated',
  'access.crawl-boards': 'Crawl boards used once the joists are hidden',
  'cables.over-insulation': 'Cables lifted above the insulation',
  'tank.no-insulation-beneath': 'Tank: nothing beneath it, top and sides lagged',
  'downlight.covers': 'Downlight covers fitted',
  'chimney.clearance': 'Clearance kept around the chimney',
  'flue.clearance': 'Clearance kept around the flue',
  'boarded.raise-or-leave': 'Boarded area raised or left',
  'hatch.insulate-and-seal': 'Hatch insulated and draught-sealed',
  'walkway.boards-span-joists': 'Walkway boards span several joists, raised',
  'existing.damp': 'Damp found and dealt with',
  'other.check': 'Other exclusions checked',
};
/** Reminders that are shown, not ticked. */
const NOT_TICKED = new Set(['local-regulations']);

export function sheetChecks(takeoff: Takeoff): SheetCheck[] {
  return (takeoff.siteChecks ?? [])
    .filter((c) => !NOT_TICKED.has(c.code))
    .map((c) => ({ code: String(c.code), title: CHECK_TITLES[c.code] ?? String(c.message).split(/[.:;]/)[0], detail: String(c.message) }));
}

function sheetLayer(l: TakeoffLayer): SheetLayer {
  const key = layerKeyOf(l);
  return {
    key,
    role: l.role,
    label: layerLabel(l),
    productName: String(l.productName),
    thicknessMm: Number(l.thicknessMm),
    areaM2: Number(l.areaM2),
    layDirectionDeg: (Math.atan2(l.layDirection[1], l.layDirection[0]) * 180) / Math.PI,
    strips: l.strips.map((s) => sheetStrip(key, s)),
  };
}

function sheetStrip(key: string, s: TakeoffLayer['strips'][number]): SheetStrip {
  const polygons = s.polygons.map((poly) => poly.map((p) => [Number(p[0]), Number(p[1])] as [number, number]));
  return {
    id: `${key}:${s.number}`,
    number: s.number,
    label: String(s.label),
    layerKey: key,
    lengthMm: Number(s.lengthMm),
    widthMm: Number(s.widthMm),
    polygons,
    labelAt: [Number(s.labelAt[0]), Number(s.labelAt[1])] as [number, number],
  };
}

/**
 * Rolls of a layer with their lanes; in each lane the pieces in cutting order (the roll plan's),
 * then the pieces cut from that lane's offcuts, with the width where a piece is cut narrower.
 */
function sheetRolls(l: TakeoffLayer, minOffcutMm: number): SheetRoll[] {
  const key = layerKeyOf(l);
  const byNumber = new Map(l.strips.map((s) => [s.number, s]));
  const rolls = new Map<number, SheetRoll>();
  const laneWidth = Number(l.laneWidthMm);
  const cutOf = (number: number, pieceIndex: number, lengthMm: number, widthMm: number | undefined, from?: string): SheetCut => {
    const strip = byNumber.get(number);
    return {
      id: `${key}:${number}/${pieceIndex + 1}`,
      stripId: `${key}:${number}`,
      stripNumber: number,
      stripLabel: String(strip?.label ?? number),
      piece: pieceIndex + 1,
      pieceCount: strip?.pieces.length ?? 1,
      lengthMm: Number(lengthMm),
      ...(widthMm !== undefined && widthMm < laneWidth - 0.5 ? { widthMm: Number(widthMm) } : {}),
      ...(from ? { fromOffcut: String(from) } : {}),
    };
  };
  const laneOf = (roll: number, lane: number) => {
    const r = rolls.get(roll) ?? { layerKey: key, rollNo: roll, productName: String(l.productName), lanes: [] };
    rolls.set(roll, r);
    let ln = r.lanes.find((x) => x.lane === lane);
    if (!ln) r.lanes.push((ln = { lane, widthMm: laneWidth, cuts: [], offcutMm: 0 }));
    return ln;
  };
  for (const lane of l.packing.lanes) {
    const ln = laneOf(lane.roll, lane.lane);
    ln.cuts.push(...lane.cuts.map((c) => cutOf(c.stripNumber, c.pieceIndex, c.lengthMm, c.widthMm)));
    ln.offcutMm = Number(lane.leftoverMm);
    ln.offcutKeep = Number(lane.leftoverMm) + 1e-6 >= minOffcutMm;
  }
  for (const s of l.strips) {
    for (const p of s.pieces) if (p.source === 'offcut') laneOf(p.roll, p.lane).cuts.push(cutOf(s.number, p.pieceIndex, p.lengthMm, p.widthMm, p.from));
  }
  for (const r of rolls.values()) r.lanes.sort((a, b) => a.lane - b.lane);
  return [...rolls.values()].sort((a, b) => a.rollNo - b.rollNo);
}

type PlanLike = {
  outline?: [number, number][];
  eavesEdges?: number[];
  eavesGapMm?: number;
  joists?: { angleDeg: number; centresMm: number; widthMm: number; offsetMm?: number };
  exclusions?: { kind: string; label?: string; polygon?: [number, number][]; at?: [number, number] }[];
};

function sheetPlan(plan: unknown): SheetSpace['plan'] {
  const p = plan as PlanLike | null;
  if (!p || !Array.isArray(p.outline) || p.outline.length < 3 || !p.joists) return null;
  return {
    outline: p.outline.map((q) => [Number(q[0]), Number(q[1])] as [number, number]),
    eavesEdges: (p.eavesEdges ?? []).map(Number),
    eavesGapMm: Number(p.eavesGapMm ?? 50),
    joists: {
      angleDeg: Number(p.joists.angleDeg),
      centresMm: Number(p.joists.centresMm),
      widthMm: Number(p.joists.widthMm),
      offsetMm: Number(p.joists.offsetMm ?? 0),
    },
    exclusions: (p.exclusions ?? []).map((e) => ({
      kind: String(e.kind),
      label: String(e.label ?? ''),
      polygon: e.polygon ? e.polygon.map((q) => [Number(q[0]), Number(q[1])] as [number, number]) : null,
      at: e.at ? ([Number(e.at[0]), Number(e.at[1])] as [number, number]) : null,
    })),
  };
}

/** One space of the job sheet from its latest revision (or a clear problem when there is none). */
export function sheetSpace(space: { id: string; name: string }, row: RevisionRow | undefined): SheetSpace {
  const empty = { layers: [], rolls: [], checks: [], netAreaM2: null, uValueBefore: null, uValueAfter: null, thermalText: null };
  if (!row)
    return { id: space.id, name: space.name, revision: null, plan: null, ...empty, problem: 'No plan has been drawn for this space yet: ask the office.' };
  const plan = sheetPlan(row.plan);
  const t = readStoredTakeoff(row.takeoff);
  if (!t) {
    return {
      id: space.id,
      name: space.name,
      revision: row.revision,
      plan,
      ...empty,
      problem: 'The takeoff for this plan has not been worked out: ask the office to open and save the plan.',
    };
  }
  return {
    id: space.id,
    name: space.name,
    revision: row.revision,
    plan,
    netAreaM2: Number(t.netAreaM2),
    uValueBefore: Number(t.uValueBefore),
    uValueAfter: Number(t.uValueAfter),
    thermalText: thermalFactsText(t),
    layers: t.layers.map(sheetLayer),
    rolls: t.layers.flatMap((l) => sheetRolls(l, Number(t.settings?.minOffcutMm ?? 500))),
    checks: sheetChecks(t),
    problem: null,
  };
}

const EXTRA_UNITS: Partial<Record<ExtraKind, string>> = { pipe_lagging: 'm', disposal: 'job' };

/**
 * Rolls per product over all spaces (from the roll plan) and the extras, by the same rule and the
 * company settings the quote uses (shared/quote/extras.ts), named as in the company catalogue.
 */
export function vanLoad(rows: RevisionRow[], rules: ExtraRules, catalogueExtras: readonly Pick<Extra, 'kind' | 'name' | 'unit' | 'active'>[]): VanLoad {
  const rolls = new Map<string, VanLoad['rolls'][number]>();
  const spaces = [];
  const takeoffs: Takeoff[] = [];
  for (const row of rows) {
    const t = readStoredTakeoff(row.takeoff);
    if (!t) continue;
    takeoffs.push(t);
    for (const l of t.layers) {
      const r = rolls.get(l.productId) ?? { productId: l.productId, productName: String(l.productName), thicknessMm: Number(l.thicknessMm), count: 0 };
      r.count += Number(l.rollsByPacking);
      rolls.set(l.productId, r);
    }
    spaces.push(spaceForQuote('', t));
  }
  // The job's spaces share their rolls per product, as the quote counts them.
  for (const [productId, n] of jobRollsByProduct(takeoffs)) {
    const r = rolls.get(productId);
    if (r) r.count = n;
  }
  const extras: VanLoad['extras'] = extrasFor(spaces, rules).map(({ kind, quantity }) => {
    const item = catalogueExtras.find((e) => e.kind === kind && e.active);
    return { code: kind, label: item?.name ?? EXTRA_KIND_LABELS[kind], quantity, unit: item?.unit ?? EXTRA_UNITS[kind] ?? 'each' };
  });
  return { rolls: [...rolls.values()].sort((a, b) => a.productName.localeCompare(b.productName)), extras };
}

/** Net area to insulate per job, m², summed over the stored takeoffs of its spaces' latest revisions (jobs with none are absent). */
export async function jobAreasM2(jobIds: string[]): Promise<Map<string, number>> {
  const out = new Map<string, number>();
  for (const { space, revision } of await latestRevisionsOfJobs(jobIds)) {
    const t = readStoredTakeoff(revision?.takeoff);
    if (t) out.set(space.jobId, (out.get(space.jobId) ?? 0) + t.netAreaM2);
  }
  return out;
}

/** Exclusion kinds in the latest plans of a job's spaces (for the customer's preparation e-mail). */
export async function planExclusionKinds(jobId: string): Promise<ExclusionKind[]> {
  const rows = await latestRevisionsOfJobs([jobId]);
  return [...new Set(rows.flatMap((r) => ((r.revision?.plan as PlanLike | undefined)?.exclusions ?? []).map((e) => e.kind as ExclusionKind)))];
}
