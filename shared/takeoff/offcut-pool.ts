import { orderByPositiveKeys, sortNumbersAscending } from '../geometry/sort-numbers';

/**
 * Offcuts of one product while its roll plan is made: rectangles of insulation (length along
 * the roll × width) with where they came from. Guillotine cuts: taking a piece from an offcut
 * leaves at most two rectangles (the lengthwise rest beside it and the end beyond it). Pure
 * helpers over a mutable pool; lengths mm, areas mm².
 */

/** One offcut: `lengthMm` along the roll, `widthMm` across it, from lane `lane` of roll `roll`. */
export interface Offcut {
  lengthMm: number;
  widthMm: number;
  from: string;
  roll: number;
  lane: number;
  /** At least the minimum usable length and the minimum strip width: worth keeping. */
  reusable?: boolean;
}

const EPS = 1e-6;

/** An offcut in the pool, numbered in the order it was made (the order ties are broken in). */
type PoolOffcut = Offcut & { seq: number };

/**
 * The offcuts on hand. Those that cannot hold the smallest strip still to be asked for
 * (`askLengthMm × askWidthMm`, either way round) are kept apart as scraps, so the searches for a
 * strip only look at offcuts that might hold one (a plan with many cut-outs makes thousands of
 * scraps a few mm wide); scraps serve the fills. `closeOffcutPool` merges them back in the order made.
 */
export interface OffcutPool {
  items: PoolOffcut[];
  scraps: PoolOffcut[];
  askLengthMm: number;
  askWidthMm: number;
  made: number;
}

/** An empty pool for strips no shorter than `askLengthMm` and no narrower than `askWidthMm`. */
export function newOffcutPool(askLengthMm: number, askWidthMm: number): OffcutPool {
  return { items: [], scraps: [], askLengthMm, askWidthMm, made: 0 };
}

/** Puts an offcut in the pool: with the candidates for strips, or with the scraps. */
export function addOffcut(pool: OffcutPool, lengthMm: number, widthMm: number, from: string, roll: number, lane: number): void {
  const o: PoolOffcut = { lengthMm, widthMm, from, roll, lane, seq: pool.made++ };
  const al = pool.askLengthMm - EPS;
  const aw = pool.askWidthMm - EPS;
  if ((lengthMm >= al && widthMm >= aw) || (widthMm >= al && lengthMm >= aw)) pool.items.push(o);
  else pool.scraps.push(o);
}

/**
 * Once no strip will be cut from offcuts: merges the scraps back in (every offcut in `items`, in
 * the order made, as if never kept apart) and puts any later offcut in `items` too.
 */
export function closeOffcutPool(pool: OffcutPool): void {
  const a = pool.items;
  const b = pool.scraps;
  const out: PoolOffcut[] = [];
  let i = 0;
  let j = 0;
  while (i < a.length || j < b.length) out.push(j >= b.length || (i < a.length && a[i].seq < b[j].seq) ? a[i++] : b[j++]);
  pool.items = out;
  pool.scraps = [];
  pool.askLengthMm = -Infinity;
  pool.askWidthMm = -Infinity;
}

/**
 * Takes a `lengthMm × widthMm` piece from the smallest offcut (by area) that holds it, either
 * way round, and puts back what is left. Returns the offcut used, or null when none holds it.
 */
export function takeFromOffcuts(pool: OffcutPool, lengthMm: number, widthMm: number): Offcut | null {
  let best = -1;
  let bestArea = Infinity;
  let turned = false;
  for (let i = 0; i < pool.items.length; i++) {
    const o = pool.items[i];
    const a = o.lengthMm * o.widthMm;
    if (a >= bestArea) continue;
    if (o.lengthMm + EPS >= lengthMm && o.widthMm + EPS >= widthMm) {
      best = i;
      bestArea = a;
      turned = false;
    } else if (o.widthMm + EPS >= lengthMm && o.lengthMm + EPS >= widthMm) {
      best = i;
      bestArea = a;
      turned = true;
    }
  }
  if (best < 0) return null;
  const o = pool.items[best];
  pool.items.splice(best, 1);
  const ol = turned ? o.widthMm : o.lengthMm;
  const ow = turned ? o.lengthMm : o.widthMm;
  // Keep the bigger rest whole: cut across the offcut's length or along it, whichever leaves it.
  const endRest = { lengthMm: ol - lengthMm, widthMm: ow };
  const sideRest = { lengthMm: lengthMm, widthMm: ow - widthMm };
  const alongFirst = endRest.lengthMm * endRest.widthMm >= sideRest.lengthMm * sideRest.widthMm;
  const rests = alongFirst
    ? [endRest, sideRest]
    : [
        { lengthMm: ol - lengthMm, widthMm: widthMm },
        { lengthMm: ol, widthMm: ow - widthMm },
      ];
  for (const r of rests) if (r.lengthMm > 1 && r.widthMm > 1) addOffcut(pool, r.lengthMm, r.widthMm, o.from, o.roll, o.lane);
  return o;
}

/**
 * Fills `areaMm2` of slivers from the offcuts (`items` of a closed pool), smallest first (the
 * scraps nobody else wants), removing what it uses; `items` is left sorted by area. Returns the
 * area the offcuts could not cover, mm².
 */
export function takeFills(items: Offcut[], areaMm2: number): number {
  if (!(areaMm2 > EPS)) return 0;
  sortByArea(items);
  let need = areaMm2;
  let used = 0;
  while (used < items.length && need > EPS) {
    const o = items[used];
    const a = o.lengthMm * o.widthMm;
    if (a <= need + EPS) {
      need -= a;
      used++;
    } else {
      // Part of this offcut: the fill comes off its end.
      o.lengthMm -= need / o.widthMm;
      need = 0;
    }
  }
  items.splice(0, used);
  return Math.max(0, need);
}

/**
 * Sorts offcuts by area, smallest first, ties in the order given (a stable sort). The areas are
 * worked out once and radix-sorted (`orderByPositiveKeys`); should one not be positive, they are
 * sorted as numbers and each offcut is placed at the first slot of its area still free. A skewed
 * plan leaves thousands of cut-outs here.
 */
function sortByArea(items: Offcut[]): void {
  const n = items.length;
  const area = new Float64Array(n);
  for (let i = 0; i < n; i++) area[i] = items[i].lengthMm * items[i].widthMm;
  const was = items.slice();
  const order = orderByPositiveKeys(area);
  if (order) {
    for (let k = 0; k < n; k++) items[k] = was[order[k]];
    return;
  }
  const sorted = area.slice();
  sortNumbersAscending(sorted, 0, n);
  // Slots taken so far in each run of equal areas, counted at the run's first index.
  const taken = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const a = area[i];
    let lo = 0;
    let hi = n;
    while (lo < hi) {
      const mid = (lo + hi) >> 1;
      if (sorted[mid] < a) lo = mid + 1;
      else hi = mid;
    }
    items[lo + taken[lo]++] = was[i];
  }
}

/**
 * Takes a `lengthMm × widthMm` strip from several offcuts butted end to end (longest first),
 * every piece at least `minPieceMm` long. Returns the pieces (offcut used, length taken), or
 * null, leaving the pool untouched, when the offcuts wide enough are too short together.
 */
export function takeButted(pool: OffcutPool, lengthMm: number, widthMm: number, minPieceMm: number): { from: Offcut; lengthMm: number }[] | null {
  const wide = pool.items.filter((o) => o.widthMm + EPS >= widthMm && o.lengthMm + EPS >= minPieceMm).sort((a, b) => b.lengthMm - a.lengthMm);
  const out: { from: PoolOffcut; lengthMm: number }[] = [];
  let left = lengthMm;
  for (const o of wide) {
    if (left <= EPS) break;
    // Leave at least one minimum piece for the end of the strip.
    let take = Math.min(o.lengthMm, left);
    if (left - take > EPS && left - take < minPieceMm) take = left - minPieceMm;
    if (take + EPS < minPieceMm) continue;
    out.push({ from: o, lengthMm: take });
    left -= take;
  }
  if (left > EPS) return null;
  for (const p of out) {
    takeFromOffcutItem(pool, p.from, p.lengthMm, widthMm);
  }
  return out;
}

/** Cuts `lengthMm × widthMm` off one given offcut of the pool, putting the rests back. */
function takeFromOffcutItem(pool: OffcutPool, o: PoolOffcut, lengthMm: number, widthMm: number): void {
  const i = pool.items.indexOf(o);
  if (i < 0) return;
  pool.items.splice(i, 1);
  const rests = [
    { lengthMm: o.lengthMm - lengthMm, widthMm: o.widthMm },
    { lengthMm, widthMm: o.widthMm - widthMm },
  ];
  for (const r of rests) if (r.lengthMm > 1 && r.widthMm > 1) addOffcut(pool, r.lengthMm, r.widthMm, o.from, o.roll, o.lane);
}
