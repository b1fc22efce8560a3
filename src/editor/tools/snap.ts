import type { Plan } from '../../../shared/plan/plan-schema';
import { pxToMm, round3, snapAngle, snapToGrid, world, type WorldPt } from '../geometry/coords';
import { hitCorner } from './hit-test';
import { hitPx, SNAP_GRID_MM, type ToolContext, type ToolPointer } from './tool';

/**
 * Where a placed or dragged point lands: an existing corner nearby, else (from a previous corner)
 * the nearest 45° direction with the length on the grid step, else the grid. Alt: free (1 mm).
 */
export function snapPoint(ctx: ToolContext, e: ToolPointer, plan: Plan, opts: { from?: [number, number]; ignoreCorner?: number } = {}): [number, number] {
  const p = e.world;
  if (e.alt) return [Math.round(p.x), Math.round(p.y)];
  const tol = pxToMm(ctx.camera(), hitPx(e));
  const c = hitCorner(plan, p, tol);
  if (c >= 0 && c !== opts.ignoreCorner) return [plan.outline[c][0], plan.outline[c][1]];
  let q: WorldPt;
  if (opts.from) {
    q = snapAngle(world(opts.from[0], opts.from[1]), p, 45, SNAP_GRID_MM);
  } else {
    q = snapToGrid(p, SNAP_GRID_MM);
  }
  return [round3(q.x), round3(q.y)];
}
