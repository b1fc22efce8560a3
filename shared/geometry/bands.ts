import type { Vec2 } from './vector';
import type { Ring } from './polygon';
import { unionPolygons } from './boolean';

/**
 * Band clipping: cut a polygonal area into the pieces that fall inside parallel bands.
 *
 * Work in a strip frame (see transform.ts): bands are slabs `lo ≤ t ≤ hi` of the second
 * coordinate and pieces run along the first (`s`). Within a band, the slab is split at every
 * vertex height so that each sub-slab is crossed only by straight edges; pairing the crossings
 * by x (even-odd rule) gives trapezoids, and trapezoids of neighbouring sub-slabs whose shared
 * sides overlap join into one piece (union-find). This is the classic trapezoidal
 * decomposition (de Berg et al., Computational Geometry, ch. 6) restricted to the bands, and it
 * costs O(E log E + pieces) instead of one polygon boolean per band.
 *
 * The rings must describe a region by the even-odd rule without overlaps (as polygon-clipping
 * returns: outer rings and their holes). Winding does not matter.
 */

/** A band: the slab `loMm ≤ t ≤ hiMm` in frame coordinates. */
export interface Band {
  loMm: number;
  hiMm: number;
}

/** One connected piece of the region inside one band, in frame coordinates. */
export interface BandPiece {
  /** Index into the bands array passed in. */
  bandIndex: number;
  /** Extent along the band: the piece spans `sMinMm..sMaxMm`. */
  sMinMm: number;
  sMaxMm: number;
  /** Exact area of the piece, mm². */
  areaMm2: number;
  /** Outline of the piece in frame coordinates (positive signed area). */
  polygon: Vec2[];
  /** Holes inside the piece, if any (rare: an obstacle wholly inside the band). */
  holes: Vec2[][];
}

interface Edge {
  xa: number;
  ya: number;
  xb: number;
  yb: number;
}

interface Trap {
  slab: number;
  y0: number;
  y1: number;
  l0: number;
  l1: number;
  r0: number;
  r1: number;
}

const EPS = 1e-7;

/**
 * Pieces of the region (`rings`, frame coordinates) inside each band. Bands must be sorted by
 * `loMm` and must not overlap. Pieces smaller than `minAreaMm2` (slivers where a band grazes
 * a corner) are dropped. Output is ordered by band, then by `sMinMm`.
 */
export function clipRegionToBands(rings: Ring[], bands: Band[], minAreaMm2 = 1): BandPiece[] {
  const edges: Edge[] = [];
  const ys: number[] = [];
  for (const ring of rings) {
    const n = ring.length;
    for (let i = 0; i < n; i++) {
      const a = ring[i];
      const b = ring[(i + 1) % n];
      ys.push(a[1]);
      if (a[1] === b[1]) continue;
      edges.push(a[1] < b[1] ? { xa: a[0], ya: a[1], xb: b[0], yb: b[1] } : { xa: b[0], ya: b[1], xb: a[0], yb: a[1] });
    }
  }
  edges.sort((e, f) => e.ya - f.ya);
  const yv = Float64Array.from(ys).sort();
  const out: BandPiece[] = [];
  let next = 0;
  let active: Edge[] = [];
  for (let bi = 0; bi < bands.length; bi++) {
    const { loMm: lo, hiMm: hi } = bands[bi];
    if (!(hi - lo > EPS)) continue;
    while (next < edges.length && edges[next].ya < hi) active.push(edges[next++]);
    active = active.filter((e) => e.yb > lo);
    if (active.length === 0) continue;
    // Sub-slab boundaries: the band's edges and every vertex height strictly inside it.
    const cuts = [lo];
    for (let k = lowerBound(yv, lo + EPS); k < yv.length && yv[k] < hi - EPS; k++) {
      if (yv[k] - cuts[cuts.length - 1] > EPS) cuts.push(yv[k]);
    }
    cuts.push(hi);
    const traps: Trap[] = [];
    const slabStart: number[] = [];
    for (let si = 0; si + 1 < cuts.length; si++) {
      slabStart.push(traps.length);
      const y0 = cuts[si];
      const y1 = cuts[si + 1];
      const ym = (y0 + y1) / 2;
      const xs: { m: number; at0: number; at1: number }[] = [];
      for (const e of active) {
        if (e.ya < ym && e.yb > ym) {
          const k = (e.xb - e.xa) / (e.yb - e.ya);
          xs.push({ m: e.xa + k * (ym - e.ya), at0: e.xa + k * (Math.max(y0, e.ya) - e.ya), at1: e.xa + k * (Math.min(y1, e.yb) - e.ya) });
        }
      }
      xs.sort((p, q) => p.m - q.m);
      for (let k = 0; k + 1 < xs.length; k += 2) {
        traps.push({ slab: si, y0, y1, l0: xs[k].at0, l1: xs[k].at1, r0: xs[k + 1].at0, r1: xs[k + 1].at1 });
      }
    }
    slabStart.push(traps.length);
    if (traps.length === 0) continue;
    const parent = traps.map((_, i) => i);
    const find = (i: number): number => {
      while (parent[i] !== i) i = parent[i] = parent[parent[i]];
      return i;
    };
    for (let si = 1; si + 1 < slabStart.length; si++) {
      for (let a = slabStart[si - 1]; a < slabStart[si]; a++) {
        for (let b = slabStart[si]; b < slabStart[si + 1]; b++) {
          const ta = traps[a];
          const tb = traps[b];
          if (Math.min(ta.r1, tb.r0) - Math.max(ta.l1, tb.l0) > EPS) parent[find(a)] = find(b);
        }
      }
    }
    const groups = new Map<number, Trap[]>();
    for (let i = 0; i < traps.length; i++) {
      const r = find(i);
      const g = groups.get(r);
      if (g) g.push(traps[i]);
      else groups.set(r, [traps[i]]);
    }
    const pieces: BandPiece[] = [];
    for (const g of groups.values()) {
      let area = 0;
      let sMin = Infinity;
      let sMax = -Infinity;
      for (const t of g) {
        area += ((t.r0 - t.l0 + (t.r1 - t.l1)) / 2) * (t.y1 - t.y0);
        sMin = Math.min(sMin, t.l0, t.l1);
        sMax = Math.max(sMax, t.r0, t.r1);
      }
      if (area < minAreaMm2) continue;
      const { polygon, holes } = pieceOutline(g);
      pieces.push({ bandIndex: bi, sMinMm: sMin, sMaxMm: sMax, areaMm2: area, polygon, holes });
    }
    pieces.sort((p, q) => p.sMinMm - q.sMinMm);
    out.push(...pieces);
  }
  return out;
}

function lowerBound(a: Float64Array, v: number): number {
  let lo = 0;
  let hi = a.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (a[mid] < v) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

function pieceOutline(g: Trap[]): { polygon: Vec2[]; holes: Vec2[][] } {
  g.sort((a, b) => a.slab - b.slab);
  let chain = true;
  for (let i = 1; i < g.length; i++) if (g[i].slab !== g[i - 1].slab + 1) chain = false;
  if (chain) {
    // One trapezoid per sub-slab: walk up the left side and down the right side.
    const pts: Vec2[] = [[g[0].l0, g[0].y0]];
    for (const t of g) pts.push([t.l1, t.y1]);
    for (let i = g.length - 1; i >= 0; i--) pts.push([g[i].r1, g[i].y1]);
    pts.push([g[0].r0, g[0].y0]);
    return { polygon: simplifyRing(pts), holes: [] };
  }
  const merged = unionPolygons(g.map((t) => [[[t.l0, t.y0], [t.r0, t.y0], [t.r1, t.y1], [t.l1, t.y1]] as Vec2[]]));
  let best = merged[0];
  for (const p of merged) if (p[0].length > best[0].length) best = p;
  return { polygon: simplifyRing(best[0].map((p) => [p[0], p[1]] as Vec2)), holes: best.slice(1).map((r) => r.map((p) => [p[0], p[1]] as Vec2)) };
}

/** Drop repeated and collinear points (within 1e-6 mm); winding is made positive. */
function simplifyRing(pts: Vec2[]): Vec2[] {
  let out: Vec2[] = [];
  for (const p of pts) {
    const q = out[out.length - 1];
    if (!q || Math.abs(q[0] - p[0]) > 1e-6 || Math.abs(q[1] - p[1]) > 1e-6) out.push(p);
  }
  if (out.length > 1) {
    const a = out[0];
    const b = out[out.length - 1];
    if (Math.abs(a[0] - b[0]) <= 1e-6 && Math.abs(a[1] - b[1]) <= 1e-6) out.pop();
  }
  let changed = true;
  while (changed && out.length > 3) {
    changed = false;
    const keep: Vec2[] = [];
    const n = out.length;
    for (let i = 0; i < n; i++) {
      const a = out[(i + n - 1) % n];
      const b = out[i];
      const c = out[(i + 1) % n];
      const cross = (b[0] - a[0]) * (c[1] - b[1]) - (b[1] - a[1]) * (c[0] - b[0]);
      const scale = Math.hypot(b[0] - a[0], b[1] - a[1]) + Math.hypot(c[0] - b[0], c[1] - b[1]);
      if (Math.abs(cross) <= 1e-6 * scale) changed = true;
      else keep.push(b);
    }
    if (keep.length < 3) break;
    out = keep;
  }
  let s = 0;
  for (let i = 0; i < out.length; i++) {
    const a = out[i];
    const b = out[(i + 1) % out.length];
    s += a[0] * b[1] - b[0] * a[1];
  }
  return s < 0 ? out.reverse() : out;
}
