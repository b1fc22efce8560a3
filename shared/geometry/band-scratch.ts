import { RIBBON_FIELDS } from './ribbons';

/**
 * Working space of band clipping (see bands.ts and band-pieces.ts): a band's trapezoids and the
 * scratch arrays that join them into pieces, all typed arrays kept and grown from band to band.
 */

/**
 * A band's trapezoids, one column per field: trapezoid `i` spans `y0[i]..y1[i]` across the band,
 * its left side runs from `l0[i]` (at y0) to `l1[i]` (at y1), its right side from `r0[i]` to
 * `r1[i]`. `n` is the count; the arrays grow as needed and are reused for the next band.
 */
export interface Trapezoids {
  n: number;
  y0: Float64Array;
  y1: Float64Array;
  l0: Float64Array;
  l1: Float64Array;
  r0: Float64Array;
  r1: Float64Array;
}

/** Scratch space for `bandPieces`, reused from band to band (grown as needed). */
export interface PieceScratch {
  ints: Int32Array[];
  floats: Float64Array[];
  /**
   * Where the pieces' ribbons go: each piece keeps a view of its part, so a chunk is never
   * reused, only replaced when full (`startRibbons` at the start of each call). One typed array
   * per piece would be one allocation outside the heap each; a plain array, garbage to collect.
   */
  ribbons: Float64Array;
  ribbonsUsed: number;
  /** Ribbon numbers the current call has taken so far, and a size for its first chunk: the larger of the last calls' (a takeoff clips a plan's layers one after another, each about the same). */
  ribbonsTaken: number;
  ribbonsHint: number;
  xs: Float64Array;
  ys: Float64Array;
  keep: Int32Array;
}

export function newTrapezoids(cap = 256): Trapezoids {
  const f = () => new Float64Array(cap);
  return { n: 0, y0: f(), y1: f(), l0: f(), l1: f(), r0: f(), r1: f() };
}

export function newPieceScratch(): PieceScratch {
  return {
    ints: [],
    floats: [],
    ribbons: new Float64Array(0),
    ribbonsUsed: 0,
    ribbonsTaken: 0,
    ribbonsHint: 0,
    xs: new Float64Array(64),
    ys: new Float64Array(64),
    keep: new Int32Array(64),
  };
}

/** Ribbon numbers per chunk at most (see `PieceScratch.ribbons`). */
const RIBBON_CHUNK = RIBBON_FIELDS * 4096;

/** Starts a new call's ribbons: pieces of earlier calls keep the chunks they point into. */
export function startRibbons(S: PieceScratch): void {
  S.ribbonsHint = Math.max(S.ribbonsTaken, S.ribbonsHint / 2);
  S.ribbonsTaken = 0;
  S.ribbons = new Float64Array(0);
  S.ribbonsUsed = 0;
}

/** Room for `need` more ribbon numbers in the current chunk, starting a new one when full. */
export function reserveRibbons(S: PieceScratch, need: number): void {
  S.ribbonsTaken += need;
  if (S.ribbonsUsed + need <= S.ribbons.length) return;
  // The first chunk of a call as large as the last calls needed; then chunks double, up to a cap.
  const want = S.ribbons.length ? 2 * S.ribbons.length : Math.max(S.ribbonsHint, 64 * RIBBON_FIELDS);
  S.ribbons = new Float64Array(Math.max(need, Math.min(RIBBON_CHUNK, want)));
  S.ribbonsUsed = 0;
}

function grown(a: Float64Array, cap: number): Float64Array {
  const b = new Float64Array(cap);
  b.set(a);
  return b;
}

export function pushTrapezoid(t: Trapezoids, y0: number, y1: number, l0: number, l1: number, r0: number, r1: number): void {
  if (t.n === t.y0.length) {
    const cap = t.n * 2;
    t.y0 = grown(t.y0, cap);
    t.y1 = grown(t.y1, cap);
    t.l0 = grown(t.l0, cap);
    t.l1 = grown(t.l1, cap);
    t.r0 = grown(t.r0, cap);
    t.r1 = grown(t.r1, cap);
  }
  const i = t.n++;
  t.y0[i] = y0;
  t.y1[i] = y1;
  t.l0[i] = l0;
  t.l1[i] = l1;
  t.r0[i] = r0;
  t.r1[i] = r1;
}

/** The `k`-th integer scratch array with room for `n` (contents undefined). */
export function ints(s: PieceScratch, k: number, n: number): Int32Array {
  let a = s.ints[k];
  if (!a || a.length < n) a = s.ints[k] = new Int32Array(Math.max(n, 2 * (a?.length ?? 32)));
  return a;
}

/** The `k`-th float scratch array with room for `n` (contents undefined). */
export function floats(s: PieceScratch, k: number, n: number): Float64Array {
  let a = s.floats[k];
  if (!a || a.length < n) a = s.floats[k] = new Float64Array(Math.max(n, 2 * (a?.length ?? 32)));
  return a;
}
