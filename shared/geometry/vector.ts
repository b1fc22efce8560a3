/**
 * Plane vectors in millimetres. Plan space has y pointing down, as on a screen, so a positive
 * angle turns from +x towards +y (clockwise as drawn). All functions are pure and allocate a new
 * tuple; none mutates its arguments.
 */

/** A point or vector `[x, y]` in millimetres (plan space unless a name says otherwise). */
export type Vec2 = [number, number];

/** Dot product. */
export function vecDot(a: readonly number[], b: readonly number[]): number {
  return a[0] * b[0] + a[1] * b[1];
}

/** Unit vector at `angleDeg` from the +x axis (towards +y for positive angles). */
export function unitVectorFromDeg(angleDeg: number): Vec2 {
  const r = (angleDeg * Math.PI) / 180;
  // Snap exact multiples of 90° so that axis-aligned plans give exact integer coordinates.
  const c = Math.abs(Math.cos(r)) < 1e-15 ? 0 : Math.cos(r);
  const s = Math.abs(Math.sin(r)) < 1e-15 ? 0 : Math.sin(r);
  return [c, s];
}

/** The vector turned +90° (from +x towards +y): `[-y, x]`. */
export function vecPerp(a: readonly number[]): Vec2 {
  return [-a[1], a[0]];
}
