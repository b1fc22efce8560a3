import type { Plan } from '../../../shared/plan/plan-schema';
import { CommandError, checkIndex, type Pt } from './command';
import { round3 } from '../geometry/coords';

/** Walls within this angle (radians, about 0.06°) of the typed wall count as parallel to it. */
const PARALLEL_SIN = 1e-3;

/**
 * Sets the length of edge `edge` (from corner `edge` to the next, mm) and keeps the other walls'
 * directions where the outline allows it, so a square room stays square:
 * the end corner moves along the edge by the change d; each following wall that is not parallel to
 * the edge moves with it unchanged (both its corners shift by d), until a wall parallel to the edge
 * takes up the change in its own length. In a rectilinear outline that is the wall after next, so
 * every wall keeps its direction and only the typed wall and its opposite change length.
 *
 * Skewed outlines: when no later wall is parallel to the edge, there is nothing that can take up
 * the change without turning, so only the end corner moves (along the edge) and the next wall
 * turns to meet it; `keptSquare` in the result says which happened. A change that would shrink
 * the absorbing wall to nothing or fold it back is refused with a message naming both walls.
 */
export function setEdgeLength(plan: Plan, args: { edge: number; lengthMm: number }): Plan {
  return setEdgeLengthDetailed(plan, args).plan;
}

/** As `setEdgeLength`, also telling whether the other walls kept their directions. */
export function setEdgeLengthDetailed(plan: Plan, args: { edge: number; lengthMm: number }): { plan: Plan; keptSquare: boolean } {
  const n = plan.outline.length;
  checkIndex(args.edge, n, 'edge');
  if (!(args.lengthMm > 0) || !Number.isFinite(args.lengthMm)) throw new CommandError(`edge ${args.edge + 1}: a length must be a positive number of mm`);
  const a = plan.outline[args.edge];
  const j = (args.edge + 1) % n;
  const b = plan.outline[j];
  const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
  if (len === 0) throw new CommandError(`edge ${args.edge + 1} has no length, so no direction to stretch along`);
  const ux = (b[0] - a[0]) / len,
    uy = (b[1] - a[1]) / len;
  const d = args.lengthMm - len;
  const dx = ux * d,
    dy = uy * d;
  const shift = (p: Pt | readonly [number, number]): Pt => [round3(p[0] + dx), round3(p[1] + dy)];

  // Corners j, j+1, … move while the wall leaving them is not parallel to the typed edge.
  const moved = [j];
  let k = j;
  let absorber = -1;
  while (true) {
    const next = (k + 1) % n;
    if (next === args.edge) break; // back at the typed wall's start: no parallel wall
    const p = plan.outline[k],
      q = plan.outline[next];
    const wl = Math.hypot(q[0] - p[0], q[1] - p[1]);
    if (wl > 0 && Math.abs(ux * (q[1] - p[1]) - uy * (q[0] - p[0])) / wl < PARALLEL_SIN) {
      absorber = k;
      break;
    }
    moved.push(next);
    k = next;
  }

  const outline = plan.outline.slice() as Pt[];
  if (absorber < 0) {
    outline[j] = shift(b);
    return { plan: { ...plan, outline }, keptSquare: false };
  }
  const p = plan.outline[absorber],
    q = plan.outline[(absorber + 1) % n];
  const along = (q[0] - p[0]) * ux + (q[1] - p[1]) * uy; // signed length along the typed edge
  const after = along - d;
  if (Math.sign(after) !== Math.sign(along) || Math.abs(after) < 1) {
    throw new CommandError(
      `edge ${args.edge + 1} at ${Math.round(args.lengthMm)} mm would shrink edge ${absorber + 1} (${Math.round(Math.abs(along))} mm, opposite it) to nothing; drag the corners instead`,
    );
  }
  for (const i of moved) outline[i] = shift(plan.outline[i]);
  return { plan: { ...plan, outline }, keptSquare: true };
}
