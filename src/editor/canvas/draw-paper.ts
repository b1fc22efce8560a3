import { gridStepMm, screen, screenToWorld } from '../geometry/coords';
import { sx, sy, type DrawContext } from './draw-context';
import { PALETTE } from './palette';

/** Warm paper with a faint 100 mm grid (coarser when zoomed out) and a stronger line every metre. */
export function drawPaper(d: DrawContext) {
  const { ctx, cam, width, height } = d;
  ctx.fillStyle = PALETTE.paper;
  ctx.fillRect(0, 0, width, height);
  const step = gridStepMm(cam, 5);
  const tl = screenToWorld(cam, screen(0, 0));
  const br = screenToWorld(cam, screen(width, height));
  for (const [strong, stepMm] of [
    [false, step],
    [true, step * 10],
  ] as const) {
    ctx.beginPath();
    for (let x = Math.floor(tl.x / stepMm) * stepMm; x <= br.x; x += stepMm) {
      const px = Math.round(sx(cam, x)) + 0.5;
      ctx.moveTo(px, 0);
      ctx.lineTo(px, height);
    }
    for (let y = Math.floor(tl.y / stepMm) * stepMm; y <= br.y; y += stepMm) {
      const py = Math.round(sy(cam, y)) + 0.5;
      ctx.moveTo(0, py);
      ctx.lineTo(width, py);
    }
    ctx.strokeStyle = strong ? PALETTE.paperLineStrong : PALETTE.paperLine;
    ctx.lineWidth = 1;
    ctx.stroke();
  }
}
