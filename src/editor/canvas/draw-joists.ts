import type { Plan } from '../../../shared/plan/plan-schema';
import { joistSegments } from '../geometry/lines';
import { sx, sy, type DrawContext } from './draw-context';
import { PALETTE } from './palette';

/** The joists as thin timber-brown lines (true width when zoomed in far enough). */
export function drawJoists(d: DrawContext, plan: Plan, highlighted: boolean) {
  const { ctx, cam } = d;
  const segs = joistSegments(plan.outline, plan.joists);
  ctx.beginPath();
  for (const [a, b] of segs) {
    ctx.moveTo(sx(cam, a[0]), sy(cam, a[1]));
    ctx.lineTo(sx(cam, b[0]), sy(cam, b[1]));
  }
  ctx.strokeStyle = PALETTE.timber;
  ctx.globalAlpha = highlighted ? 0.9 : 0.55;
  ctx.lineWidth = Math.max(1, plan.joists.widthMm * cam.zoom * (highlighted ? 1 : 0.6));
  ctx.stroke();
  ctx.globalAlpha = 1;
}
