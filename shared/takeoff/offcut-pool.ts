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

/** The offcuts on hand and the smallest piece worth cutting from them. */
export interface OffcutPool {
  items: Offcut[];
  minLengthMm: number;
  minWidthMm: number;
}

const EPS = 1e-6;

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
  for (const r of rests) if (r.lengthMm > 1 && r.widthMm > 1) pool.items.push({ ...r, from: o.from, roll: o.roll, lane: o.lane });
  return o;
}

/**
 * Fills `areaMm2` of slivers from the offcuts, smallest first (the scraps nobody else wants),
 * removing what it uses. Returns the area the offcuts could not cover, mm².
 */
export function takeFills(pool: OffcutPool, areaMm2: number): number {
  if (!(areaMm2 > EPS)) return 0;
  pool.items.sort((a, b) => a.lengthMm * a.widthMm - b.lengthMm * b.widthMm);
  let need = areaMm2;
  let used = 0;
  while (used < pool.items.length && need > EPS) {
    const o = pool.items[used];
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
  pool.items.splice(0, used);
  return Math.max(0, need);
}

/**
 * Takes a `lengthMm × widthMm` strip from several offcuts butted end to end (longest first),
 * every piece at least `minPieceMm` long. Returns the pieces (offcut used, length taken), or
 * null, leaving the pool untouched, when the offcuts wide enough are too short together.
 */
export function takeButted(pool: OffcutPool, lengthMm: number, widthMm: number, minPieceMm: number): { from: Offcut; lengthMm: number }[] | null {
  const wide = pool.items.filter((o) => o.widthMm + EPS >= widthMm && o.lengthMm + EPS >= minPieceMm).sort((a, b) => b.lengthMm - a.lengthMm);
  const out: { from: Offcut; lengthMm: number }[] = [];
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
function takeFromOffcutItem(pool: OffcutPool, o: Offcut, lengthMm: number, widthMm: number): void {
  const i = pool.items.indexOf(o);
  if (i < 0) return;
  pool.items.splice(i, 1);
  const rests = [
    { lengthMm: o.lengthMm - lengthMm, widthMm: o.widthMm },
    { lengthMm, widthMm: o.widthMm - widthMm },
  ];
  for (const r of rests) if (r.lengthMm > 1 && r.widthMm > 1) pool.items.push({ ...r, from: o.from, roll: o.roll, lane: o.lane });
}
