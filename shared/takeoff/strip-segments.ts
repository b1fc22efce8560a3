import { SNAP_MM, type Ribbon } from '../geometry/bands';

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
export function stripSegments(ribbons: Ribbon[], minSegmentMm: number): { segments: StripSegment[]; gaps: { lengthMm: number; acrossMm: number }[] } {
  const gaps: { lengthMm: number; acrossMm: number }[] = [];
  for (const r of ribbons) {
    const gap = r.sHiMm - r.sLoMm - r.coveredMm;
    if (gap > 1 + SNAP_MM) gaps.push({ lengthMm: gap, acrossMm: r.t1 - r.t0 });
  }
  if (ribbons.length === 1) {
    const r = ribbons[0];
    return { segments: [{ lengthMm: r.sHiMm - r.sLoMm, coveredWidthMm: r.t1 - r.t0 }], gaps };
  }
  // Each end as runs of ribbons where it is continuous (an end cut on the angle, however many
  // ribbons it crosses), placed at the run's mean: a step is where the end jumps.
  const lo = endRuns(
    ribbons,
    (r) => r.lo0,
    (r) => r.lo1,
  );
  const hi = endRuns(
    ribbons,
    (r) => r.hi0,
    (r) => r.hi1,
  );
  // A typed array sorts numbers natively (no comparator call per comparison).
  const xs = new Float64Array(2 * ribbons.length);
  for (let j = 0; j < ribbons.length; j++) {
    xs[2 * j] = lo[j];
    xs[2 * j + 1] = hi[j];
  }
  xs.sort();
  let segs: StripSegment[] = [];
  for (let k = 0; k + 1 < xs.length; k++) {
    const len = xs[k + 1] - xs[k];
    if (len <= 1e-6) continue;
    const mid = (xs[k] + xs[k + 1]) / 2;
    let t0 = Infinity;
    let t1 = -Infinity;
    for (let j = 0; j < ribbons.length; j++) {
      if (lo[j] <= mid && hi[j] >= mid) {
        if (ribbons[j].t0 < t0) t0 = ribbons[j].t0;
        if (ribbons[j].t1 > t1) t1 = ribbons[j].t1;
      }
    }
    const w = t1 > t0 ? t1 - t0 : 0;
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
    const n = segs[into];
    segs[into] = { lengthMm: n.lengthMm + segs[k].lengthMm, coveredWidthMm: Math.max(n.coveredWidthMm, segs[k].coveredWidthMm) };
    segs = segs.filter((_, i) => i !== k);
    // Neighbours left with the same width become one length.
    const merged: StripSegment[] = [];
    for (const s of segs) {
      const m = merged[merged.length - 1];
      if (m && Math.abs(m.coveredWidthMm - s.coveredWidthMm) < 1 + SNAP_MM) m.lengthMm += s.lengthMm;
      else merged.push({ ...s });
    }
    segs = merged;
  }
  return { segments: segs, gaps };
}

/** Per ribbon, the position of its end: the height-weighted mean over the run of ribbons through which that end continues. */
function endRuns(ribbons: Ribbon[], at0: (r: Ribbon) => number, at1: (r: Ribbon) => number): number[] {
  const out = new Array<number>(ribbons.length);
  let start = 0;
  for (let j = 0; j <= ribbons.length; j++) {
    const breaks =
      j === ribbons.length || (j > start && (Math.abs(at0(ribbons[j]) - at1(ribbons[j - 1])) > 1 + SNAP_MM || ribbons[j].t0 - ribbons[j - 1].t1 > 1e-6));
    if (!breaks) continue;
    let sum = 0;
    let h = 0;
    for (let k = start; k < j; k++) {
      const r = ribbons[k];
      sum += ((at0(r) + at1(r)) / 2) * (r.t1 - r.t0);
      h += r.t1 - r.t0;
    }
    for (let k = start; k < j; k++) out[k] = h > 0 ? sum / h : (at0(ribbons[k]) + at1(ribbons[k])) / 2;
    start = j;
  }
  return out;
}
