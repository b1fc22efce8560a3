import type { Plan } from '../../../shared/plan/plan-schema';
import { CommandError, checkIndex } from './command';
import { round3 } from '../geometry/coords';

export type BoxMm = { minX: number; minY: number; maxX: number; maxY: number };

/** The bounding box (mm) of a list of points. */
export function boxOf(points: ReadonlyArray<readonly [number, number]>): BoxMm {
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  for (const [x, y] of points) {
    minX = Math.min(minX, x);
    minY = Math.min(minY, y);
    maxX = Math.max(maxX, x);
    maxY = Math.max(maxY, y);
  }
  return { minX, minY, maxX, maxY };
}

/**
 * Stretches polygon exclusion `index` so its bounding box becomes `box` (mm); every corner keeps
 * its relative place, so rectangles stay rectangles. Point exclusions have no size.
 */
export function resizeExclusion(plan: Plan, args: { index: number; box: BoxMm }): Plan {
  checkIndex(args.index, plan.exclusions.length, 'exclusion');
  const e = plan.exclusions[args.index];
  if (!e.polygon) throw new CommandError('a point exclusion has no size to change');
  const nb = {
    minX: Math.min(args.box.minX, args.box.maxX),
    maxX: Math.max(args.box.minX, args.box.maxX),
    minY: Math.min(args.box.minY, args.box.maxY),
    maxY: Math.max(args.box.minY, args.box.maxY),
  };
  if (nb.maxX - nb.minX < 10 || nb.maxY - nb.minY < 10) throw new CommandError('an exclusion must be at least 10 mm each way');
  const ob = boxOf(e.polygon);
  const sx = ob.maxX > ob.minX ? (nb.maxX - nb.minX) / (ob.maxX - ob.minX) : 1;
  const sy = ob.maxY > ob.minY ? (nb.maxY - nb.minY) / (ob.maxY - ob.minY) : 1;
  const polygon = e.polygon.map(([x, y]): [number, number] => [round3(nb.minX + (x - ob.minX) * sx), round3(nb.minY + (y - ob.minY) * sy)]);
  const exclusions = plan.exclusions.slice();
  exclusions[args.index] = { ...e, polygon };
  return { ...plan, exclusions };
}
