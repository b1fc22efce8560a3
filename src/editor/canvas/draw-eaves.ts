import type { Plan } from '../../../shared/plan/plan-schema';
import { outwardNormal } from '../geometry/lines';
import { sx, sy, type DrawContext } from './draw-context';
import { PALETTE } from './palette';

/**
 * The ventilation band along each eaves edge in pale sky blue: the true gap width inward, drawn
 * at least 5 px wide so a 25 mm gap stays visible when zoomed out.
 */
export function drawEaves(d: DrawContext, plan: Plan) {
  const { ctx, cam } = d;
  const n = plan.outline.length;
  if (n < 3) return;
  const widthMm = Math.max(plan.eavesGapMm, 5 / cam.zoom);
  for (const e of plan.eavesEdges) {
    if (e >= n) continue;
    const a = plan.outline[e];
    const b = plan.outline[(e + 1) % n];
    const [ox, oy] = outwardNormal(plan.outline, e);
    const ix = -ox * widthMm,
      iy = -oy * widthMm;
    ctx.beginPath();
    ctx.moveTo(sx(cam, a[0]), sy(cam, a[1]));
    ctx.lineTo(sx(cam, b[0]), sy(cam, b[1]));
    ctx.lineTo(sx(cam, b[0] + ix), sy(cam, b[1] + iy));
    ctx.lineTo(sx(cam, a[0] + ix), sy(cam, a[1] + iy));
    ctx.closePath();
    ctx.fillStyle = PALETTE.sky;
    ctx.globalAlpha = 0.75;
    ctx.fill();
    ctx.globalAlpha = 1;
    // A wavy-free marker: small ticks along the outside say "air in here".
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    const stepMm = 30 / cam.zoom;
    ctx.beginPath();
    for (let t = stepMm / 2; t < len; t += stepMm) {
      const px = a[0] + ((b[0] - a[0]) * t) / len,
        py = a[1] + ((b[1] - a[1]) * t) / len;
      ctx.moveTo(sx(cam, px) + ox * 3, sy(cam, py) + oy * 3);
      ctx.lineTo(sx(cam, px) + ox * 9, sy(cam, py) + oy * 9);
    }
    ctx.strokeStyle = PALETTE.skyDark;
    ctx.lineWidth = 1.5;
    ctx.stroke();
  }
}
