import { SNAP_MM } from '../geometry/bands';
import {
  ribbonCount,
  RIBBON_COVERED,
  RIBBON_FIELDS,
  RIBBON_HI0,
  RIBBON_HI1,
  RIBBON_LO0,
  RIBBON_LO1,
  RIBBON_S_HI,
  RIBBON_S_LO,
  RIBBON_T0,
  RIBBON_T1,
} from '../geometry/ribbons';
import { sortNumbersAscending } from '../geometry/sort-numbers';

// Per-ribbon ends and their sorted list, kept from call to call (grown as needed): typed arrays
// over 64 bytes live outside the heap and cost far more to make than to fill.
let scratch = { lo: new Float64Array(64), hi: new Float64Array(64), xs: new Float64Array(128) };

/** A length of a strip with one width: the whole band width, or the part of it covered. */
export interface StripSegment {
  /** Along the band, unrounded, mm (an end cut on the angle counts at its middle). */
  lengthMm: number;
  /** Width across the band covered over this length, mm. */
  coveredWidthMm: number;
}

/**
 * Splits a band piece along its length where its covered width changes (a lane crossing an L's
 * inside corner covers the whole lane up to the wall and only part of it beyond), so each
 * length is cut at the width it covers. Lengths shorter than `minSegmentMm` join the wider
 * neighbour (cutting a short step narrower saves nothing). Ribbons come from
 * `clipRegionToBands`; ends are ribbon means, so an end cut on the angle counts at its middle.
 * Also returns the gaps where the piece forks around an obstacle inside the band (cut out of
 * the strip and kept as offcuts: length × width across, mm).
 */
export function stripSegments(ribbons: Float64Array, minSegmentMm: number): { segments: StripSegment[]; gaps: { lengthMm: number; acrossMm: number }[] } {
  const R = ribbons;
  const n = ribbonCount(R);
  const gaps: { lengthMm: number; acrossMm: number }[] = [];
  for (let o = 0; o < R.length; o += RIBBON_FIELDS) {
    const gap = R[o + RIBBON_S_HI] - R[o + RIBBON_S_LO] - R[o + RIBBON_COVERED];
    if (gap > 1 + SNAP_MM) gaps.push({ lengthMm: gap, acrossMm: R[o + RIBBON_T1] - R[o + RIBBON_T0] });
  }
  if (n === 1) return { segments: [{ lengthMm: R[RIBBON_S_HI] - R[RIBBON_S_LO], coveredWidthMm: R[RIBBON_T1] - R[RIBBON_T0] }], gaps };
  // Each end as runs of ribbons where it is continuous (an end cut on the angle, however many
  // ribbons it crosses), placed at the run's mean: a step is where the end jumps.
  if (scratch.lo.length < n) scratch = { lo: new Float64Array(2 * n), hi: new Float64Array(2 * n), xs: new Float64Array(4 * n) };
  const { lo, hi, xs } = scratch;
  endRuns(R, n, RIBBON_LO0, RIBBON_LO1, lo);
  endRuns(R, n, RIBBON_HI0, RIBBON_HI1, hi);
  // The ends, sorted, bound the lengths. A run of ribbons shares one end value: listed once (a
  // repeated value only adds lengths of zero, which are skipped), so few values are sorted.
  let nx = 0;
  for (let j = 0; j < n; j++) if (j === 0 || lo[j] !== lo[j - 1]) xs[nx++] = lo[j];
  for (let j = 0; j < n; j++) if (j === 0 || hi[j] !== hi[j - 1]) xs[nx++] = hi[j];
  sortNumbersAscending(xs, 0, nx);
  const segs: StripSegment[] = [];
  for (let k = 0; k + 1 < nx; k++) {
    const len = xs[k + 1] - xs[k];
    if (len <= 1e-6) continue;
    const mid = (xs[k] + xs[k + 1]) / 2;
    // Ribbons are sub-slabs in order across the band, so of those reaching `mid` the first has
    // the least t0 and the last the greatest t1: look for them from either end.
    let first = 0;
    while (first < n && !(lo[first] <= mid && hi[first] >= mid)) first++;
    let w = 0;
    if (first < n) {
      let last = n - 1;
      while (!(lo[last] <= mid && hi[last] >= mid)) last--;
      const t0 = R[first * RIBBON_FIELDS + RIBBON_T0];
      const t1 = R[last * RIBBON_FIELDS + RIBBON_T1];
      w = t1 > t0 ? t1 - t0 : 0;
    }
    const last = segs[segs.length - 1];
    if (last && Math.abs(last.coveredWidthMm - w) < 1 + SNAP_MM) last.lengthMm += len;
    else segs.push({ lengthMm: len, coveredWidthMm: w });
  }
  // Fold short lengths into the wider neighbour until every length is worth its own cut.
  while (segs.length > 1) {
    let k = -1;
    for (let i = 0; i < segs.length; i++) if (segs[i].lengthMm < minSegmentMm - SNAP_MM && (k < 0 || segs[i].lengthMm < segs[k].lengthMm)) k = i;
    if (k < 0) break;
    const a = segs[k - 1];
    const b = segs[k + 1];
    const into = !b || (a && a.coveredWidthMm >= b.coveredWidthMm) ? k - 1 : k + 1;
    // In place: the lengths are this call's own objects.
    const n = segs[into];
    n.lengthMm = n.lengthMm + segs[k].lengthMm;
    n.coveredWidthMm = Math.max(n.coveredWidthMm, segs[k].coveredWidthMm);
    segs.splice(k, 1);
    // Neighbours left with the same width become one length.
    let kept = 0;
    for (let i = 0; i < segs.length; i++) {
      const m = kept > 0 ? segs[kept - 1] : undefined;
      if (m && Math.abs(m.coveredWidthMm - segs[i].coveredWidthMm) < 1 + SNAP_MM) m.lengthMm += segs[i].lengthMm;
      else segs[kept++] = segs[i];
    }
    segs.length = kept;
  }
  return { segments: segs, gaps };
}

/**
 * Per ribbon, the position of one end (fields `f0` at t0 and `f1` at t1) into `out`: the
 * height-weighted mean over the run of ribbons through which that end continues.
 */
function endRuns(R: Float64Array, n: number, f0: number, f1: number, out: Float64Array): void {
  let start = 0;
  for (let j = 0; j <= n; j++) {
    const o = j * RIBBON_FIELDS;
    const breaks =
      j === n || (j > start && (Math.abs(R[o + f0] - R[o - RIBBON_FIELDS + f1]) > 1 + SNAP_MM || R[o + RIBBON_T0] - R[o - RIBBON_FIELDS + RIBBON_T1] > 1e-6));
    if (!breaks) continue;
    let sum = 0;
    let h = 0;
    for (let k = start; k < j; k++) {
      const q = k * RIBBON_FIELDS;
      sum += ((R[q + f0] + R[q + f1]) / 2) * (R[q + RIBBON_T1] - R[q + RIBBON_T0]);
      h += R[q + RIBBON_T1] - R[q + RIBBON_T0];
    }
    for (let k = start; k < j; k++) {
      const q = k * RIBBON_FIELDS;
      out[k] = h > 0 ? sum / h : (R[q + f0] + R[q + f1]) / 2;
    }
    start = j;
  }
}
