import type { Plan } from '../../../shared/plan/plan-schema';
import { CommandError } from './command';

/**
 * Rescales the background so the two picked points `a` and `b` (mm, as currently drawn) end up
 * `realMm` apart, keeping `a` where it is on the plan.
 */
export function calibrateBackground(plan: Plan, args: { a: [number, number]; b: [number, number]; realMm: number }): Plan {
  const bg = plan.background;
  if (!bg) throw new CommandError('upload a background image before calibrating it');
  if (bg.locked) throw new CommandError('the background is locked: unlock it to calibrate');
  const drawnMm = Math.hypot(args.b[0] - args.a[0], args.b[1] - args.a[1]);
  if (drawnMm < 1) throw new CommandError('pick two points further apart');
  if (!(args.realMm > 0) || !Number.isFinite(args.realMm)) throw new CommandError('type the real distance in mm');
  const k = args.realMm / drawnMm;
  const [ax, ay] = args.a;
  const [ox, oy] = bg.originMm;
  return {
    ...plan,
    background: { ...bg, mmPerPx: bg.mmPerPx * k, originMm: [ax + (ox - ax) * k, ay + (oy - ay) * k] },
  };
}
