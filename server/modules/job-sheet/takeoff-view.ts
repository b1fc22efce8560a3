import { QueryTypes } from 'sequelize';
import type { SheetCheck, SheetCut, SheetLayer, SheetRoll, SheetSpace, SheetStrip, VanLoad } from '../../../shared/api/job-sheet';
import type { ExclusionKind } from '../../../shared/plan/plan-schema';
import type { Takeoff, TakeoffLayer } from '../../../shared/takeoff/takeoff-types';
import { Job } from '../../db/models';
import { isTakeoff } from '../plans/plans.takeoff';

/**
 * The installer's view of saved takeoffs. Every field is copied by name: a takeoff also carries
 * prices (per layer, per product, yearly savings in money) and none of that may reach an installer.
 */

export type RevisionRow = { space_id: string; revision: number; plan: unknown; takeoff: unknown };

/** The latest plan revision of each space (one query). */
export async function latestRevisionRows(spaceIds: string[]): Promise<Map<string, RevisionRow>> {
  if (spaceIds.length === 0) return new Map();
  const rows = await Job.sequelize!.query<RevisionRow>(
    `SELECT DISTINCT ON (space_id) space_id, revision, plan, takeoff
       FROM plan_revisions WHERE space_id IN (:ids) ORDER BY space_id, revision DESC`,
    { replacements: { ids: spaceIds }, type: QueryTypes.SELECT },
  );
  return new Map(rows.map((r) => [r.space_id, r]));
}

export { isTakeoff };

export const layerKeyOf = (l: Pick<TakeoffLayer, 'role' | 'roleIndex'>) => (l.role === 'base' ? 'base' : `cross${l.roleIndex + 1}`);
const layerLabel = (l: TakeoffLayer) => (l.role === 'base' ? 'Base layer' : `Cross layer ${l.roleIndex + 1}`);

// Short titles for the checks the takeoff raises (shared/takeoff/site-checks.ts); its message is the detail.
const CHECK_TITLES: Record<string, string> = {
  'access.work-at-height': 'Safe access: ladder, light, joists or boards only',
  'ppe.dust': 'PPE worn: gloves, goggles, mask',
  'eaves.ventilation-gap': 'Ventilation gap kept at the eaves',
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

type Pair = [number, number];
/** A strip's shape: `polygons` in current takeoffs, a single `polygon` in ones saved before that change. */
function stripPolygons(s: TakeoffLayer['strips'][number]): Pair[][] {
  const loose = s as unknown as { polygons?: Pair[][]; polygon?: Pair[] };
  return loose.polygons ?? (loose.polygon ? [loose.polygon] : []);
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
  const polygons = stripPolygons(s).map((poly) => poly.map((p) => [Number(p[0]), Number(p[1])] as [number, number]));
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

/** Rolls of a layer with their lanes; in each lane the pieces in laying order (strip number, then piece). */
function sheetRolls(l: TakeoffLayer): SheetRoll[] {
  const key = layerKeyOf(l);
  const byNumber = new Map(l.strips.map((s) => [s.number, s]));
  const rolls = new Map<number, SheetRoll>();
  for (const lane of l.packing.lanes) {
    const roll = rolls.get(lane.roll) ?? { layerKey: key, rollNo: lane.roll, productName: String(l.productName), lanes: [] };
    const cuts: SheetCut[] = [...lane.cuts]
      .sort((a, b) => a.stripNumber - b.stripNumber || a.pieceIndex - b.pieceIndex)
      .map((c) => {
        const strip = byNumber.get(c.stripNumber);
        return {
          id: `${key}:${c.stripNumber}/${c.pieceIndex + 1}`,
          stripId: `${key}:${c.stripNumber}`,
          stripNumber: c.stripNumber,
          stripLabel: String(strip?.label ?? c.stripNumber),
          piece: c.pieceIndex + 1,
          pieceCount: strip?.pieces.length ?? 1,
          lengthMm: Number(c.lengthMm),
        };
      });
    roll.lanes.push({ lane: lane.lane, widthMm: Number(l.laneWidthMm), cuts, offcutMm: Number(lane.leftoverMm) });
    rolls.set(lane.roll, roll);
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
  const empty = { layers: [], rolls: [], checks: [], netAreaM2: null, uValueBefore: null, uValueAfter: null };
  if (!row)
    return { id: space.id, name: space.name, revision: null, plan: null, ...empty, problem: 'No plan has been drawn for this space yet: ask the office.' };
  const plan = sheetPlan(row.plan);
  if (!isTakeoff(row.takeoff)) {
    return {
      id: space.id,
      name: space.name,
      revision: row.revision,
      plan,
      ...empty,
      problem: 'The takeoff for this plan has not been worked out: ask the office to open and save the plan.',
    };
  }
  const t = row.takeoff;
  return {
    id: space.id,
    name: space.name,
    revision: row.revision,
    plan,
    netAreaM2: Number(t.netAreaM2),
    uValueBefore: Number(t.uValueBefore),
    uValueAfter: Number(t.uValueAfter),
    layers: t.layers.map(sheetLayer),
    rolls: t.layers.flatMap(sheetRolls),
    checks: sheetChecks(t),
    problem: null,
  };
}

/**
 * Rolls per product over all spaces (from the roll plan) and the extras the plans call for.
 * Extras: one hatch kit per hatch, a jacket per tank, a cover per downlight, an eaves tray per
 * rafter space along the eaves with rafters taken at the joist centres, three walkway boards per
 * tank — common practice, not a standard; the office's quote may list more.
 */
export function vanLoad(rows: RevisionRow[]): VanLoad {
  const rolls = new Map<string, { productName: string; thicknessMm: number; count: number }>();
  const counts: Record<string, number> = {};
  let eavesTrays = 0;
  let boardedM2 = 0;
  for (const row of rows) {
    if (!isTakeoff(row.takeoff)) continue;
    const t = row.takeoff;
    for (const l of t.layers) {
      const k = `${l.productName}|${l.thicknessMm}`;
      const r = rolls.get(k) ?? { productName: String(l.productName), thicknessMm: Number(l.thicknessMm), count: 0 };
      r.count += Number(l.rollsByPacking);
      rolls.set(k, r);
    }
    for (const [kind, n] of Object.entries(t.exclusions?.countsByKind ?? {})) counts[kind] = (counts[kind] ?? 0) + Number(n);
    const centres = (row.plan as PlanLike | null)?.joists?.centresMm ?? 400;
    eavesTrays += Math.ceil((t.eaves?.totalLengthMm ?? 0) / centres);
    boardedM2 += Number(t.exclusions?.boardedAreaM2 ?? 0);
  }
  const extras: VanLoad['extras'] = [];
  const add = (label: string, quantity: number, unit: string) => quantity > 0 && extras.push({ label, quantity, unit });
  add('Hatch insulation and draught-seal kit', counts.hatch ?? 0, 'each');
  add('Tank jacket', counts.tank ?? 0, 'each');
  add('Pipe lagging for the tank pipes', counts.tank ? 1 : 0, 'set');
  add('Fire-rated downlight cover', counts.downlight ?? 0, 'each');
  add('Eaves ventilation tray', eavesTrays, 'each');
  add('Walkway board', (counts.tank ?? 0) * 3, 'each');
  add('Board-raising legs for the boarded area', Math.round(boardedM2 * 10) / 10, 'm²');
  return { rolls: [...rolls.values()].sort((a, b) => a.productName.localeCompare(b.productName)), extras };
}

/** Net area to insulate per job, m², summed over the latest takeoffs of its spaces (jobs with none are absent). */
export async function jobAreasM2(jobIds: string[]): Promise<Map<string, number>> {
  if (jobIds.length === 0) return new Map();
  const rows = await Job.sequelize!.query<{ job_id: string; takeoff: unknown }>(
    `SELECT DISTINCT ON (r.space_id) s.job_id, r.takeoff
       FROM plan_revisions r JOIN spaces s ON s.id = r.space_id
      WHERE s.job_id IN (:ids) ORDER BY r.space_id, r.revision DESC`,
    { replacements: { ids: jobIds }, type: QueryTypes.SELECT },
  );
  const out = new Map<string, number>();
  for (const r of rows) if (isTakeoff(r.takeoff)) out.set(r.job_id, (out.get(r.job_id) ?? 0) + Number(r.takeoff.netAreaM2));
  return out;
}

/** Exclusion kinds in the latest plans of a job's spaces (for the customer's preparation e-mail). */
export async function planExclusionKinds(jobId: string): Promise<ExclusionKind[]> {
  const rows = await Job.sequelize!.query<{ plan: PlanLike }>(
    `SELECT DISTINCT ON (r.space_id) r.plan FROM plan_revisions r JOIN spaces s ON s.id = r.space_id
      WHERE s.job_id = :jobId ORDER BY r.space_id, r.revision DESC`,
    { replacements: { jobId }, type: QueryTypes.SELECT },
  );
  return [...new Set(rows.flatMap((r) => (r.plan?.exclusions ?? []).map((e) => e.kind as ExclusionKind)))];
}
