import type { ExtraKind, ExtraRules } from '../api/settings';
import type { ExclusionKind } from '../plan/plan-schema';

/** What the extras rule reads from one space's takeoff. */
export interface SpaceForExtras {
  exclusionCounts: Partial<Record<ExclusionKind, number>>;
  /** Boarded area whose boards are raised and insulated under, m² (board-raising legs are counted from it; boards left as they are need none). */
  raisedBoardedAreaM2: number;
  /** Eaves ventilators the takeoff counts (one per rafter space along the eaves; 0 where the insulation is kept back by a gap instead). */
  eavesVentilators: number;
}

/** One kind of extra a job needs, with the reason shown beside it. */
export interface ExtraNeed {
  kind: ExtraKind;
  quantity: number;
  why: string;
}

function fmt(n: number, digits = 2): string {
  return n.toFixed(digits).replace(/\.?0+$/, '') || '0';
}

/**
 * The extras a job's spaces call for, by the company's rules: a hatch kit per hatch, a tank jacket,
 * pipe lagging (m per tank) and walkway boards (per tank) per cold-water tank, a cover per
 * downlight, the takeoff's eaves ventilators (only where the insulation runs over the wall plate,
 * and when the company fits trays), board-raising legs per m² of boards to be raised (rounded up;
 * none for boards left as they are), disposal once per job. The per-tank and
 * per-m² counts are company settings (common practice, not a standard). The quote prices these
 * and the installer's van load lists the same quantities. Kinds with nothing needed are left out.
 */
export function extrasFor(spaces: readonly SpaceForExtras[], rules: ExtraRules): ExtraNeed[] {
  const count = (k: ExclusionKind) => spaces.reduce((n, s) => n + (s.exclusionCounts[k] ?? 0), 0);
  const tanks = count('tank');
  const boardedM2 = spaces.reduce((a, s) => a + s.raisedBoardedAreaM2, 0);
  const trays = rules.eavesTrays ? spaces.reduce((n, s) => n + s.eavesVentilators, 0) : 0;
  const wanted: ExtraNeed[] = [
    { kind: 'hatch_kit', quantity: count('hatch'), why: 'per loft hatch' },
    { kind: 'tank_jacket', quantity: tanks, why: 'per cold water tank' },
    { kind: 'pipe_lagging', quantity: Math.round(tanks * rules.pipeLaggingMPerTank * 1000) / 1000, why: `${fmt(rules.pipeLaggingMPerTank)} m per tank` },
    { kind: 'walkway_board', quantity: tanks * rules.walkwayBoardsPerTank, why: `${rules.walkwayBoardsPerTank} per tank, spanning several joists` },
    { kind: 'downlight_cover', quantity: count('downlight'), why: 'one fire-rated cover per downlight' },
    { kind: 'eaves_tray', quantity: trays, why: 'one eaves ventilator per rafter space, insulation over the wall plate' },
    {
      kind: 'board_leg',
      quantity: boardedM2 > 0 ? Math.ceil(Number((boardedM2 * rules.boardLegsPerM2).toFixed(6))) : 0,
      why: `${fmt(rules.boardLegsPerM2)} per m² of boards raised to insulate under (${fmt(boardedM2)} m²)`,
    },
    { kind: 'disposal', quantity: rules.disposalPerJob, why: 'offcuts and packaging' },
  ];
  return wanted.filter((w) => w.quantity > 0);
}
