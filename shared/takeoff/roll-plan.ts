/**
 * Packing strip pieces into roll lanes: a one-dimensional cutting-stock problem (Gilmore and
 * Gomory, 1961, from memory). Each lane of a roll is a stock length of `rollLengthMm`; a split
 * roll gives `lanesPerRoll` lanes that can be used independently. Heuristics: first-fit and
 * best-fit decreasing (Johnson, 1974: FFD uses at most 11/9·OPT + 6/9 bins); the better of the two
 * is kept. A lane's leftover is offered to later pieces only while it is at least the minimum
 * useful offcut — shorter ends are waste. All lengths in mm.
 */

/** One piece to cut: which strip (by number) and which piece of it, and how long. */
export interface PieceToCut {
  stripNumber: number;
  pieceIndex: number;
  lengthMm: number;
}

/** A cut placed in a lane, starting `offsetMm` from the lane's start. */
export interface LaneCut extends PieceToCut {
  offsetMm: number;
}

/** One lane of one roll with its cuts. `roll` and `lane` count from 1. */
export interface PackedLane {
  roll: number;
  lane: number;
  cuts: LaneCut[];
  usedMm: number;
  leftoverMm: number;
}

/** What is left at the end of a lane (or a lane never opened). */
export interface Offcut {
  roll: number;
  lane: number;
  lengthMm: number;
  /** At least the minimum useful offcut: keep it for another job. */
  reusable: boolean;
}

/** A packing of pieces into rolls. */
export interface RollPacking {
  method: 'first-fit-decreasing' | 'best-fit-decreasing';
  lanes: PackedLane[];
  lanesUsed: number;
  rolls: number;
  /** ceil(Σ lengths / lane length): no packing can use fewer lanes. */
  lanesLowerBound: number;
  offcuts: Offcut[];
  /** Total length of the rolls bought, of the pieces, and the rest, mm. */
  boughtMm: number;
  cutMm: number;
  /** (bought − cut) / bought × 100: everything bought and not laid, reusable offcuts included. */
  wastePct: number;
}

/** Options of `packPieces`. */
export interface PackOptions {
  rollLengthMm: number;
  lanesPerRoll: number;
  /** Lane ends shorter than this are not reused. 0 reuses any end. */
  minOffcutMm: number;
}

/**
 * Packs pieces into lanes with first-fit decreasing and best-fit decreasing and returns the one
 * using fewer lanes (then less waste). Pieces longer than a lane must be split by the caller;
 * one that still is longer throws. Deterministic: ties keep input order.
 */
export function packPieces(pieces: PieceToCut[], opts: PackOptions): RollPacking {
  const ffd = packWith(pieces, opts, 'first-fit-decreasing');
  if (ffd.lanesUsed === ffd.lanesLowerBound) return ffd;
  const bfd = packWith(pieces, opts, 'best-fit-decreasing');
  return bfd.lanesUsed < ffd.lanesUsed || (bfd.lanesUsed === ffd.lanesUsed && bfd.rolls < ffd.rolls) ? bfd : ffd;
}

function packWith(pieces: PieceToCut[], opts: PackOptions, method: RollPacking['method']): RollPacking {
  const L = opts.rollLengthMm;
  const sorted = pieces.map((p, i) => ({ p, i })).sort((a, b) => b.p.lengthMm - a.p.lengthMm || a.i - b.i);
  const lanes: { cuts: LaneCut[]; used: number }[] = [];
  const EPS = 1e-6;
  for (const { p } of sorted) {
    if (p.lengthMm > L + EPS) throw new Error(`piece of ${p.lengthMm} mm is longer than the ${L} mm roll`);
    let target = -1;
    let bestLeft = Infinity;
    for (let k = 0; k < lanes.length; k++) {
      const left = L - lanes[k].used;
      if (left + EPS < p.lengthMm) continue;
      // A used lane's end is only reused while it is a useful offcut.
      if (lanes[k].cuts.length && left + EPS < opts.minOffcutMm) continue;
      if (method === 'first-fit-decreasing') {
        target = k;
        break;
      }
      if (left - p.lengthMm < bestLeft) {
        bestLeft = left - p.lengthMm;
        target = k;
      }
    }
    if (target < 0) {
      lanes.push({ cuts: [], used: 0 });
      target = lanes.length - 1;
    }
    const lane = lanes[target];
    lane.cuts.push({ ...p, offsetMm: lane.used });
    lane.used += p.lengthMm;
  }
  const k = opts.lanesPerRoll;
  const rolls = Math.ceil(lanes.length / k);
  const packed: PackedLane[] = lanes.map((l, i) => ({
    roll: Math.floor(i / k) + 1,
    lane: (i % k) + 1,
    cuts: l.cuts,
    usedMm: l.used,
    leftoverMm: Math.max(0, L - l.used),
  }));
  const offcuts: Offcut[] = packed
    .filter((l) => l.leftoverMm > EPS)
    .map((l) => ({ roll: l.roll, lane: l.lane, lengthMm: l.leftoverMm, reusable: l.leftoverMm + EPS >= opts.minOffcutMm }));
  for (let i = lanes.length; i < rolls * k; i++) offcuts.push({ roll: Math.floor(i / k) + 1, lane: (i % k) + 1, lengthMm: L, reusable: true });
  const cutMm = pieces.reduce((t, p) => t + p.lengthMm, 0);
  const boughtMm = rolls * k * L;
  return {
    method,
    lanes: packed,
    lanesUsed: lanes.length,
    rolls,
    lanesLowerBound: Math.ceil(cutMm / L - 1e-9),
    offcuts,
    boughtMm,
    cutMm,
    wastePct: boughtMm > 0 ? ((boughtMm - cutMm) / boughtMm) * 100 : 0,
  };
}

/**
 * The fewest lanes any packing can use (exact branch and bound over bins, pieces in decreasing
 * order, symmetric bins skipped). Exponential: meant for small instances (about 15 pieces) in
 * tests that measure the heuristic's gap; returns `null` when `maxNodes` is exceeded.
 */
export function exactMinLanes(lengthsMm: number[], laneMm: number, maxNodes = 2_000_000): number | null {
  const items = lengthsMm.slice().sort((a, b) => b - a);
  if (items.some((x) => x > laneMm)) return null;
  const lower = Math.ceil(items.reduce((t, x) => t + x, 0) / laneMm - 1e-9);
  let best = items.length;
  let nodes = 0;
  const bins: number[] = [];
  const rec = (i: number): boolean => {
    if (++nodes > maxNodes) return false;
    if (i === items.length) {
      best = Math.min(best, bins.length);
      return true;
    }
    if (bins.length >= best) return true;
    const seen = new Set<number>();
    for (let b = 0; b < bins.length; b++) {
      if (bins[b] + items[i] > laneMm + 1e-9 || seen.has(bins[b])) continue;
      seen.add(bins[b]);
      bins[b] += items[i];
      const ok = rec(i + 1);
      bins[b] -= items[i];
      if (!ok) return false;
      if (best === lower) return true;
    }
    if (bins.length + 1 < best) {
      bins.push(items[i]);
      const ok = rec(i + 1);
      bins.pop();
      if (!ok) return false;
    }
    return true;
  };
  return rec(0) ? best : null;
}

/**
 * Rule-of-thumb roll count (common practice): `ceil(area × (1 + waste) / coverage per roll)`.
 * `wasteAllowancePct` in percent; 0 area gives 0 rolls.
 */
export function rollsByArea(areaM2: number, wasteAllowancePct: number, coverageM2PerRoll: number): number {
  if (!(areaM2 > 0)) return 0;
  return Math.ceil((areaM2 * (1 + wasteAllowancePct / 100)) / coverageM2PerRoll - 1e-9);
}
