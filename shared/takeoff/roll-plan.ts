/**
 * The roll plan: how the strips of one product are cut from its rolls, the way an installer lays
 * them. Each lane of a roll (a split roll gives `lanesPerRoll` narrower rolls) is laid
 * continuously: where a roll runs out mid-strip the next roll continues it with a butt joint, and
 * where a strip ends the rest of the roll starts the next strip. A piece is never shorter than
 * the minimum usable length (a shorter end is not worth butting in; it is kept for filling).
 * Strips narrower than the lane are cut lengthwise — from an offcut that is wide and long enough,
 * else from a lane, whose lengthwise rest joins the offcuts. Pieces below the minimum strip
 * width or area are not cut as strips: they are filled from offcuts by area. Offcuts (lane ends,
 * lengthwise rests, cut-outs at steps and around obstacles) are shared by every strip given to
 * one call, so the server pools the layers and spaces of a job per product by passing them all.
 * Pure; lengths and widths in mm, areas in mm².
 */
import { addOffcut, closeOffcutPool, newOffcutPool, takeButted, takeFills, takeFromOffcuts, type Offcut } from './offcut-pool';

export type { Offcut } from './offcut-pool';

/** A roll product as the roll plan needs it. */
export interface RollStock {
  productId: string;
  rollLengthMm: number;
  lanesPerRoll: number;
  /** Width of one lane (the roll width over the lanes), mm. */
  laneWidthMm: number;
  coverageM2PerRoll: number;
}

/** One strip to cut (or a sliver to fill). `key` is unique in the call (`B7`, `Garage C1.3`). */
export interface PieceDemand {
  key: string;
  /** Whose rolls these are (a layer, or a layer of one space): rolls opened are counted per group. */
  group: string;
  /** Cut length (true length, rounded), mm. */
  lengthMm: number;
  /** Cut width: the lane width, or less for a narrow strip, mm. */
  widthMm: number;
  /** Area the piece covers, mm². */
  areaMm2: number;
  /** `fill`: below the minimum width or area, filled from offcuts, not numbered. */
  kind: 'strip' | 'fill';
  /** What cutting it leaves (steps, gaps around obstacles), length × width in mm. */
  cutOuts?: { lengthMm: number; widthMm: number }[];
}

/** One cut in a lane, `offsetMm` from the lane's start; `part` of `parts` where butt-jointed. */
export interface LaneCut {
  key: string;
  group: string;
  part: number;
  parts: number;
  lengthMm: number;
  /** Below the lane width: cut lengthwise, the rest kept as an offcut. */
  widthMm: number;
  offsetMm: number;
}

/** One lane of one roll (both from 1) with its cuts in cutting order and what is left. */
export interface PlannedLane {
  roll: number;
  lane: number;
  cuts: LaneCut[];
  usedMm: number;
  leftoverMm: number;
}

/** A strip (or part of one) cut from an offcut rather than a lane. */
export interface OffcutCut {
  key: string;
  group: string;
  part: number;
  parts: number;
  lengthMm: number;
  widthMm: number;
  /** Where the offcut came from (`roll 2 lane 1 end`, `lengthwise rest of C1.9`…). */
  from: string;
  roll: number;
  lane: number;
}

/** The roll plan of one product. */
export interface ProductRollPlan {
  productId: string;
  rolls: number;
  lanesUsed: number;
  lanes: PlannedLane[];
  fromOffcuts: OffcutCut[];
  /** Slivers filled from offcuts: per group, how many and their area. */
  fills: { group: string; count: number; areaMm2: number }[];
  /** Offcuts nothing used (reusable: at least the minimum usable length and strip width). */
  offcuts: Offcut[];
  /** Rolls opened per group, in the order groups were given: they add up to `rolls`. */
  rollsByGroup: Record<string, number>;
  /** ceil(area covered ÷ coverage per roll): no plan can buy fewer rolls. */
  rollsLowerBound: number;
  coveredMm2: number;
  boughtMm2: number;
  /** Bought but not laid (left offcuts, waste included) over bought, %. */
  wastePct: number;
}

/** Settings of the roll plan (see `TakeoffSettings`). */
export interface RollPlanSettings {
  minOffcutMm: number;
  minStripWidthMm: number;
}

const EPS = 1e-6;

/**
 * Plans the rolls of every product over all the pieces given (one call per job pools its
 * spaces). Pieces of a product are cut in the order given (laying order); a lane end too short
 * for the next strip takes the longest later strip that fits. Throws on a piece wider than its
 * lane. Deterministic.
 */
export function planRolls(products: { stock: RollStock; pieces: PieceDemand[] }[], settings: RollPlanSettings): ProductRollPlan[] {
  return products.map(({ stock, pieces }) => planProduct(stock, pieces, settings));
}

function planProduct(stock: RollStock, pieces: PieceDemand[], st: RollPlanSettings): ProductRollPlan {
  const L = stock.rollLengthMm;
  const W = stock.laneWidthMm;
  const minUse = Math.min(st.minOffcutMm, L / 2);
  const lanes: PlannedLane[] = [];
  // Narrow strips are the only ones cut from offcuts: no strip asks for less than the shortest
  // (or the minimum usable length, where a strip is butted) and the narrowest of them.
  let askL = Infinity;
  let askW = Infinity;
  for (const p of pieces)
    if (p.kind === 'strip' && p.widthMm < W - 0.5) {
      askL = Math.min(askL, p.lengthMm, minUse);
      askW = Math.min(askW, p.widthMm);
    }
  const pool = newOffcutPool(askL, askW);
  const fromOffcuts: OffcutCut[] = [];
  const openedBy: string[] = [];
  const parts = new Map<string, number>();
  let cur: PlannedLane | null = null;
  // Read through a function: TypeScript does not see the closures below reassign `cur`.
  const current = (): PlannedLane | null => cur;

  const open = (group: string): PlannedLane => {
    if (cur && cur.leftoverMm > EPS) addLaneEnd(cur);
    const i = lanes.length;
    cur = { roll: Math.floor(i / stock.lanesPerRoll) + 1, lane: (i % stock.lanesPerRoll) + 1, cuts: [], usedMm: 0, leftoverMm: L };
    lanes.push(cur);
    if (i % stock.lanesPerRoll === 0) openedBy.push(group);
    return cur;
  };
  const cutIn = (lane: PlannedLane, p: PieceDemand, len: number) => {
    const part = (parts.get(p.key) ?? 0) + 1;
    parts.set(p.key, part);
    lane.cuts.push({ key: p.key, group: p.group, part, parts: 0, lengthMm: len, widthMm: p.widthMm, offsetMm: lane.usedMm });
    lane.usedMm += len;
    lane.leftoverMm = L - lane.usedMm;
    if (p.widthMm < W - 0.5) addOffcut(pool, len, W - p.widthMm, `lengthwise rest of ${p.key}`, lane.roll, lane.lane);
    if (part === 1 && p.cutOuts?.length) {
      const from = `cut-out of ${p.key}`;
      for (const c of p.cutOuts) if (c.lengthMm > 1 && c.widthMm > 1) addOffcut(pool, c.lengthMm, c.widthMm, from, lane.roll, lane.lane);
    }
  };
  const addLaneEnd = (l: PlannedLane) => addOffcut(pool, l.leftoverMm, W, `roll ${l.roll} lane ${l.lane} end`, l.roll, l.lane);

  // Full-width strips first, in laying order; the longest later one that fits takes a short end.
  const wide = pieces.filter((p) => p.kind === 'strip' && p.widthMm >= W - 0.5);
  const narrow = byAreaDescending(pieces.filter((p) => p.kind === 'strip' && p.widthMm < W - 0.5));
  const byLength = wide.map((_, i) => i).sort((a, b) => wide[a].lengthMm - wide[b].lengthMm || a - b);
  const done = new Uint8Array(wide.length);
  for (const p of pieces) if (p.widthMm > W + 0.5) throw new Error(`${p.key}: ${p.widthMm} mm is wider than the ${W} mm lane of ${stock.productId}`);

  const layInStream = (p: PieceDemand, fillShortEnds: boolean) => {
    let left = p.lengthMm;
    while (left > EPS) {
      const lane: PlannedLane = cur && cur.leftoverMm > EPS ? cur : open(p.group);
      const rem = lane.leftoverMm;
      if (rem + EPS >= left) {
        cutIn(lane, p, left);
        return;
      }
      const tail = left - rem;
      if (rem + EPS >= minUse && tail + EPS >= minUse) {
        cutIn(lane, p, rem);
        left = tail;
      } else if (rem + EPS >= minUse && left - minUse + EPS >= minUse) {
        // Cut a little less here so that the piece finishing the strip is not a scrap.
        cutIn(lane, p, left - minUse);
        left = minUse;
      } else {
        if (fillShortEnds) fillEnd(lane);
        open(p.group);
      }
    }
  };
  // A lane end too short for the next strip: the longest strip still to cut that fits it.
  const fillEnd = (lane: PlannedLane) => {
    for (;;) {
      const k = longestFitting(byLength, wide, done, lane.leftoverMm);
      if (k < 0) return;
      done[k] = 1;
      cutIn(lane, wide[k], wide[k].lengthMm);
    }
  };

  for (let i = 0; i < wide.length; i++) {
    if (done[i]) continue;
    done[i] = 1;
    layInStream(wide[i], true);
  }
  // Narrow strips: from an offcut (whole, else butted), else a length off a lane cut lengthwise,
  // whose rest (often several widths of the same strip) goes back to the offcuts.
  const fromPool = (p: PieceDemand, o: Offcut, len: number) => {
    const part = (parts.get(p.key) ?? 0) + 1;
    parts.set(p.key, part);
    fromOffcuts.push({ key: p.key, group: p.group, part, parts: 0, lengthMm: len, widthMm: p.widthMm, from: o.from, roll: o.roll, lane: o.lane });
  };
  for (const p of narrow) {
    let left = p.lengthMm;
    while (left > EPS) {
      const got = takeFromOffcuts(pool, left, p.widthMm);
      if (got) {
        fromPool(p, got, left);
        break;
      }
      const butted = takeButted(pool, left, p.widthMm, minUse);
      if (butted) {
        for (const b of butted) fromPool(p, b.from, b.lengthMm);
        break;
      }
      const c = current();
      let lane: PlannedLane = c && c.leftoverMm + EPS >= Math.min(minUse, left) ? c : open(p.group);
      let take = Math.min(left, lane.leftoverMm);
      if (left - take > EPS && left - take < minUse) take = left - minUse;
      if (take + EPS < Math.min(minUse, left)) {
        lane = open(p.group);
        take = Math.min(left, L);
        if (left - take > EPS && left - take < minUse) take = left - minUse;
      }
      cutIn(lane, p, take);
      left -= take;
    }
  }
  const last = current();
  if (last && last.leftoverMm > EPS) addLaneEnd(last);
  // Its end is an offcut now: what still needs material opens a new lane.
  cur = null;
  // No strip is cut from offcuts any more: every offcut is one list again, in the order made.
  closeOffcutPool(pool);

  // Slivers: packed in from whatever offcut area there is; material bought only for the shortfall.
  const fillPieces = pieces.filter((p) => p.kind === 'fill');
  const fillArea = fillPieces.reduce((t, p) => t + p.areaMm2, 0);
  const short = takeFills(pool.items, fillArea);
  if (short > EPS) {
    const len = Math.ceil(short / W / 10) * 10;
    const p: PieceDemand = { key: 'fill', group: fillPieces[0].group, lengthMm: len, widthMm: W, areaMm2: 0, kind: 'strip' };
    layInStream(p, false);
    const c = current();
    if (c && c.leftoverMm > EPS) addLaneEnd(c);
  }
  const fills = new Map<string, { group: string; count: number; areaMm2: number }>();
  for (const p of fillPieces) {
    const f = fills.get(p.group) ?? { group: p.group, count: 0, areaMm2: 0 };
    f.count++;
    f.areaMm2 += p.areaMm2;
    fills.set(p.group, f);
  }

  for (const l of lanes) for (const c of l.cuts) c.parts = parts.get(c.key) ?? 1;
  for (const c of fromOffcuts) c.parts = parts.get(c.key) ?? 1;
  const rolls = Math.ceil(lanes.length / stock.lanesPerRoll);
  for (let i = lanes.length; i < rolls * stock.lanesPerRoll; i++) {
    addOffcut(pool, L, W, 'unopened lane', rolls, (i % stock.lanesPerRoll) + 1);
  }
  const rollsByGroup: Record<string, number> = {};
  for (const p of pieces) rollsByGroup[p.group] ??= 0;
  for (const g of openedBy) rollsByGroup[g] = (rollsByGroup[g] ?? 0) + 1;
  const coveredMm2 = pieces.reduce((t, p) => t + p.areaMm2, 0);
  const boughtMm2 = rolls * stock.lanesPerRoll * L * W;
  const leftMm2 = pool.items.reduce((t, o) => t + o.lengthMm * o.widthMm, 0);
  return {
    productId: stock.productId,
    rolls,
    lanesUsed: lanes.length,
    lanes,
    fromOffcuts,
    fills: [...fills.values()],
    offcuts: pool.items
      .filter((o) => o.lengthMm > EPS && o.widthMm > EPS)
      .map(({ lengthMm, widthMm, from, roll, lane }) => ({
        lengthMm,
        widthMm,
        from,
        roll,
        lane,
        reusable: lengthMm + EPS >= st.minOffcutMm && widthMm + EPS >= st.minStripWidthMm,
      })),
    rollsByGroup,
    rollsLowerBound: Math.ceil(coveredMm2 / 1e6 / stock.coverageM2PerRoll - 1e-9),
    coveredMm2,
    boughtMm2,
    wastePct: boughtMm2 > 0 ? (leftMm2 / boughtMm2) * 100 : 0,
  };
}

/** The pieces by area (length × width), largest first, ties in the order given (a stable sort on areas worked out once). */
function byAreaDescending(pieces: PieceDemand[]): PieceDemand[] {
  const area = pieces.map((p) => p.lengthMm * p.widthMm);
  return pieces
    .map((_, i) => i)
    .sort((i, j) => area[j] - area[i] || i - j)
    .map((i) => pieces[i]);
}

/** Index into `pieces` of the longest not yet `done` with length ≤ `maxMm`, or −1 (`order` sorts by length). */
function longestFitting(order: number[], pieces: PieceDemand[], done: Uint8Array, maxMm: number): number {
  let lo = 0;
  let hi = order.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (pieces[order[mid]].lengthMm <= maxMm + EPS) lo = mid + 1;
    else hi = mid;
  }
  for (let i = lo - 1; i >= 0; i--) if (!done[order[i]]) return order[i];
  return -1;
}

/**
 * Rule-of-thumb roll count (common practice): `ceil(area × (1 + waste) / coverage per roll)`.
 * `wasteAllowancePct` in percent; 0 area gives 0 rolls.
 */
export function rollsByArea(areaM2: number, wasteAllowancePct: number, coverageM2PerRoll: number): number {
  if (!(areaM2 > 0)) return 0;
  return Math.ceil((areaM2 * (1 + wasteAllowancePct / 100)) / coverageM2PerRoll - 1e-9);
}
