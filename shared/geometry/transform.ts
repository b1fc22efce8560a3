import type { Vec2 } from './vector';
import type { Ring } from './polygon';

/** `p` turned by `angleDeg` about `origin` (default the plan origin); +x turns towards +y. */
export function rotatePoint(p: readonly number[], angleDeg: number, origin: readonly number[] = [0, 0]): Vec2 {
  const r = (angleDeg * Math.PI) / 180;
  const c = Math.cos(r);
  const s = Math.sin(r);
  const x = p[0] - origin[0];
  const y = p[1] - origin[1];
  return [origin[0] + x * c - y * s, origin[1] + x * s + y * c];
}

/** Every point of a ring turned by `angleDeg` about `origin`. */
export function rotateRing(ring: Ring, angleDeg: number, origin: readonly number[] = [0, 0]): Vec2[] {
  return ring.map((p) => rotatePoint(p, angleDeg, origin));
}

/** Every point of a ring moved by `[dx, dy]` mm. */
export function translateRing(ring: Ring, d: readonly number[]): Vec2[] {
  return ring.map((p) => [p[0] + d[0], p[1] + d[1]] as Vec2);
}

/**
 * An orthonormal frame for strips: `along` is the direction a strip runs, `across` is `along`
 * turned +90°. `toFrame` gives `[s, t]` = (p·along, p·across); `fromFrame` inverts it exactly
 * (up to rounding), so geometry can be cut in the frame and mapped back to plan space.
 */
export interface StripFrame {
  along: Vec2;
  across: Vec2;
}

/** A frame whose `along` axis is the unit vector `along` (normalised by the caller). */
export function makeStripFrame(along: readonly number[]): StripFrame {
  return { along: [along[0], along[1]], across: [-along[1], along[0]] };
}

/** Plan point → frame coordinates `[s, t]`. */
export function toFrame(frame: StripFrame, p: readonly number[]): Vec2 {
  return [p[0] * frame.along[0] + p[1] * frame.along[1], p[0] * frame.across[0] + p[1] * frame.across[1]];
}

/** Frame coordinates `[s, t]` → plan point. */
export function fromFrame(frame: StripFrame, q: readonly number[]): Vec2 {
  return [q[0] * frame.along[0] + q[1] * frame.across[0], q[0] * frame.along[1] + q[1] * frame.across[1]];
}
