import type { Plan } from '../../../shared/plan/plan-schema';
import { parseRun } from './parse-run';

/**
 * Replaces the outline with the corners of a typed run of walls (see parseRun), starting at
 * `start` (mm, default the origin). Eaves marks are cleared because the edges are new.
 * Throws RunParseError with a message naming the wall when the text cannot be read.
 */
export function closeOutlineFromRun(plan: Plan, args: { text: string; start?: [number, number] }): Plan {
  const { points } = parseRun(args.text, args.start ?? [0, 0]);
  return { ...plan, outline: points, eavesEdges: [] };
}
