/** Small planar helpers for drawing: lines clipped to a polygon, edge normals, winding. */

type P = readonly [number, number];

/** Twice the signed area (mm²); positive when the ring runs clockwise on a y-down screen. */
export function ringSignedArea2(ring: ReadonlyArray<P>): number {
  let s = 0;
  for (let i = 0, n = ring.length; i < n; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % n];
    s += a[0] * b[1] - b[0] * a[1];
  }
  return s;
}

/** Unit normal of edge a→b pointing out of the ring (whatever the winding). */
export function outwardNormal(ring: ReadonlyArray<P>, i: number): [number, number] {
  const a = ring[i];
  const b = ring[(i + 1) % ring.length];
  const len = Math.hypot(b[0] - a[0], b[1] - a[1]) || 1;
  const cw = ringSignedArea2(ring) > 0;
  const nx = (b[1] - a[1]) / len;
  const ny = -(b[0] - a[0]) / len;
  return cw ? [nx, ny] : [-nx, -ny];
}

/**
 * Pieces of the infinite line { p : p·n = d } (n a unit normal) inside the ring, as pairs of
 * points, by the even-odd rule.
 */
export function clipLineToRing(ring: ReadonlyArray<P>, n: readonly [number, number], d: number): [P, P][] {
  const dir: [number, number] = [-n[1], n[0]];
  const ts: number[] = [];
  for (let i = 0, m = ring.length; i < m; i++) {
    const a = ring[i];
    const b = ring[(i + 1) % m];
    const da = a[0] * n[0] + a[1] * n[1] - d;
    const db = b[0] * n[0] + b[1] * n[1] - d;
    // Half-open test so a line through a vertex counts once.
    if ((da < 0 && db >= 0) || (db < 0 && da >= 0)) {
      const t = da / (da - db);
      const x = a[0] + (b[0] - a[0]) * t;
      const y = a[1] + (b[1] - a[1]) * t;
      ts.push(x * dir[0] + y * dir[1]);
    }
  }
  ts.sort((x, y) => x - y);
  const out: [P, P][] = [];
  const base: [number, number] = [n[0] * d, n[1] * d];
  for (let k = 0; k + 1 < ts.length; k += 2) {
    out.push([
      [base[0] + dir[0] * ts[k], base[1] + dir[1] * ts[k]],
      [base[0] + dir[0] * ts[k + 1], base[1] + dir[1] * ts[k + 1]],
    ]);
  }
  return out;
}

/** The joist centre lines inside the outline (mm), as segments. */
export function joistSegments(outline: ReadonlyArray<P>, joists: { angleDeg: number; centresMm: number; offsetMm: number }): [P, P][] {
  if (outline.length < 3 || !(joists.centresMm > 0)) return [];
  const a = (joists.angleDeg * Math.PI) / 180;
  const n: [number, number] = [-Math.sin(a), Math.cos(a)];
  let lo = Infinity,
    hi = -Infinity;
  for (const p of outline) {
    const d = p[0] * n[0] + p[1] * n[1];
    lo = Math.min(lo, d);
    hi = Math.max(hi, d);
  }
  const c = joists.centresMm;
  const first = joists.offsetMm + Math.ceil((lo - joists.offsetMm) / c) * c;
  const out: [P, P][] = [];
  for (let d = first, k = 0; d <= hi && k < 5000; d += c, k++) out.push(...clipLineToRing(outline, n, d));
  return out;
}
