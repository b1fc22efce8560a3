import { differencePolygons, snapToBooleanGrid } from './boolean';
import { polygonBounds, type MultiPolygon, type PolygonWithHoles } from './polygon';
import { MIN_TRIMMED_RING_POINTS, ringPointsFarFromBoxes } from './ring-near-boxes';
import type { Vec2 } from './vector';

/**
 * `differencePolygons([[ring]], clips)` for a long simple ring (an outline) and clips near part
 * of it or inside it, with the same result point for point, for less: the runs of the ring far
 * from every clip go to the sweep as chords (`ringPointsFarFromBoxes`: nothing splits them, and
 * nothing they enclose is a clip), and the points of each run are put back where its chords
 * came out. That is exactly what the sweep gives the whole ring when (checked, else the whole
 * ring is swept): the chords' ends come out one after another, as they went in; none of the
 * points put back lies on a line through its neighbours (which polygon-clipping would drop, by
 * an exact test: here a test whose rounding error is bounded, so a point it cannot tell apart
 * is not guessed); and none comes before the ring's first point in the sweep (the ring would
 * start there).
 */
export function differenceOfRing(ring: Vec2[], clips: PolygonWithHoles[]): MultiPolygon {
  const drop =
    clips.length && ring.length >= MIN_TRIMMED_RING_POINTS
      ? ringPointsFarFromBoxes(
          ring,
          clips.map((c) => polygonBounds([c[0]])),
        )
      : null;
  if (!drop) return differencePolygons([[ring]], clips);
  const kept = ring.filter((_, k) => !drop[k]);
  const out = differencePolygons([[kept]], clips);
  return putRunsBack(out, ring, drop) ?? differencePolygons([[ring]], clips);
}

/** `out` with the dropped runs of `ring` back in their places, or null where that is not what the whole sweep gives. */
function putRunsBack(out: MultiPolygon, ring: Vec2[], drop: Uint8Array): MultiPolygon | null {
  const n = ring.length;
  const S = ring.map((p) => [snapToBooleanGrid(p[0]), snapToBooleanGrid(p[1])] as Vec2);
  // Regions: maximal ranges of points that are left out or beside one left out (point 0 never is).
  const inRegion = (k: number) => drop[k] === 1 || (k > 0 && drop[k - 1] === 1) || (k + 1 < n && drop[k + 1] === 1);
  for (let a = 1; a < n; a++) {
    if (!inRegion(a) || inRegion(a - 1)) continue;
    let b = a;
    while (b + 1 < n && inRegion(b + 1)) b++;
    if (!putRegionBack(out, S, drop, a, b)) return null;
    a = b;
  }
  return out;
}

/** Puts points a..b (snapped, `S`) back into the ring of `out` where the kept ones of them came out in a row. */
function putRegionBack(out: MultiPolygon, S: Vec2[], drop: Uint8Array, a: number, b: number): boolean {
  const keptIdx: number[] = [];
  for (let k = a; k <= b; k++) if (!drop[k]) keptIdx.push(k);
  for (const poly of out) {
    for (const r of poly) {
      const i = r.findIndex((p) => p[0] === S[a][0] && p[1] === S[a][1]);
      if (i < 0) continue;
      // The kept points in a row, not at the ring's start or end (its first point and the check
      // polygon-clipping makes on it stay as they were).
      if (i < 1 || i + keptIdx.length > r.length - 1) return false;
      for (let j = 0; j < keptIdx.length; j++) {
        const p = r[i + j];
        if (p[0] !== S[keptIdx[j]][0] || p[1] !== S[keptIdx[j]][1]) return false;
      }
      const first = r[0];
      for (let k = a; k <= b; k++) {
        const p = S[k];
        if (p[0] < first[0] || (p[0] === first[0] && p[1] <= first[1])) return false;
        if (!surelyTurns(k === a ? r[i - 1] : S[k - 1], p, S[(k + 1) % S.length])) return false;
      }
      (r as Vec2[]).splice(i, keptIdx.length, ...S.slice(a, b + 1).map((p) => [p[0], p[1]] as Vec2));
      return true;
    }
  }
  return false;
}

// Shewchuk's bound on the rounding error of the plain orientation determinant ("Adaptive
// precision floating-point arithmetic and fast robust geometric predicates", 1997: ccwerrboundA).
const EPSILON = 2 ** -53;
const ORIENT_ERR = (3 + 16 * EPSILON) * EPSILON;

/** Whether `p → q → r` certainly turns (the exact orientation is not zero). */
function surelyTurns(p: readonly number[], q: readonly number[], r: readonly number[]): boolean {
  const left = (p[0] - r[0]) * (q[1] - r[1]);
  const right = (p[1] - r[1]) * (q[0] - r[0]);
  return Math.abs(left - right) > ORIENT_ERR * (Math.abs(left) + Math.abs(right));
}
