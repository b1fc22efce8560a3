/**
 * A band piece cut lengthwise at every sub-slab boundary (see `BandPiece.ribbons`): one ribbon
 * per sub-slab, ordered by `t0`, stored `RIBBON_FIELDS` numbers apart in one Float64Array (a view) per
 * piece (a skewed plan cuts thousands of ribbons per layer; an object each was garbage). Frame
 * coordinates, mm. Ribbon `j`'s fields start at `j * RIBBON_FIELDS`:
 * - `RIBBON_T0`, `RIBBON_T1`: the sub-slab `t0..t1`;
 * - `RIBBON_S_LO`, `RIBBON_S_HI`: the mean of its left and right ends (an end cut on the angle
 *   counts at its middle);
 * - `RIBBON_LO0`, `RIBBON_LO1`: the left end at `t0` and `t1`; `RIBBON_HI0`, `RIBBON_HI1`: the right end;
 * - `RIBBON_COVERED`: the length actually covered (less than `sHi − sLo` where the piece forks
 *   around an obstacle).
 */
export const RIBBON_FIELDS = 9;
export const RIBBON_T0 = 0;
export const RIBBON_T1 = 1;
export const RIBBON_S_LO = 2;
export const RIBBON_S_HI = 3;
export const RIBBON_LO0 = 4;
export const RIBBON_LO1 = 5;
export const RIBBON_HI0 = 6;
export const RIBBON_HI1 = 7;
export const RIBBON_COVERED = 8;

/** Number of ribbons in a piece's ribbon array. */
export function ribbonCount(ribbons: Float64Array): number {
  return ribbons.length / RIBBON_FIELDS;
}
