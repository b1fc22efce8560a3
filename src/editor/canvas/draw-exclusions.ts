import type { Plan } from '../../../shared/plan/plan-schema';
import { boxOf } from '../commands/resize-exclusion';
import { hatch, sx, sy, traceRing, type DrawContext } from './draw-context';
import { KIND_STYLES, PALETTE, SANS } from './palette';

/** Exclusions hatched in brick red, each kind its own hatch (see KIND_STYLES and the legend). */
export function drawExclusions(d: DrawContext, plan: Plan, selected: number | null) {
  const { ctx, cam } = d;
  plan.exclusions.forEach((e, i) => {
    const st = KIND_STYLES[e.kind];
    const isSel = selected === i;
    if (e.at) {
      const x = sx(cam, e.at[0]),
        y = sy(cam, e.at[1]);
      const r = Math.max(6, 50 * cam.zoom);
      ctx.beginPath();
      ctx.arc(x, y, r, 0, Math.PI * 2);
      ctx.fillStyle = PALETTE.brickLight;
      ctx.fill();
      ctx.moveTo(x - r * 0.7, y - r * 0.7);
      ctx.lineTo(x + r * 0.7, y + r * 0.7);
      ctx.moveTo(x + r * 0.7, y - r * 0.7);
      ctx.lineTo(x - r * 0.7, y + r * 0.7);
      ctx.strokeStyle = isSel ? PALETTE.select : PALETTE.brick;
      ctx.lineWidth = isSel ? 2.5 : 1.5;
      ctx.stroke();
      return;
    }
    const poly = e.polygon!;
    const b = boxOf(poly);
    const box = { minX: sx(cam, b.minX), minY: sy(cam, b.minY), maxX: sx(cam, b.maxX), maxY: sy(cam, b.maxY) };
    ctx.save();
    ctx.beginPath();
    traceRing(d, poly);
    ctx.fillStyle = PALETTE.brickLight;
    ctx.globalAlpha = 0.45;
    ctx.fill();
    ctx.globalAlpha = 1;
    ctx.clip();
    ctx.beginPath();
    for (const a of st.angles) hatch(d, box, a, st.spacingPx);
    ctx.strokeStyle = PALETTE.brick;
    ctx.lineWidth = 1;
    ctx.stroke();
    ctx.restore();
    ctx.beginPath();
    traceRing(d, poly);
    ctx.setLineDash(st.dash);
    ctx.strokeStyle = isSel ? PALETTE.select : PALETTE.brick;
    ctx.lineWidth = isSel ? 2.5 : 1.5;
    ctx.stroke();
    ctx.setLineDash([]);
    const w = box.maxX - box.minX;
    if (w > 28) {
      const text = e.label ?? st.name.toLowerCase();
      ctx.font = `600 11px ${SANS}`;
      const tw = Math.min(ctx.measureText(text).width, w - 6);
      const cx = (box.minX + box.maxX) / 2,
        cy = (box.minY + box.maxY) / 2;
      ctx.fillStyle = 'rgba(250,247,240,0.9)';
      ctx.fillRect(cx - tw / 2 - 3, cy - 8, tw + 6, 16);
      ctx.fillStyle = PALETTE.brick;
      ctx.textAlign = 'center';
      ctx.textBaseline = 'middle';
      ctx.fillText(text, cx, cy, w - 6);
    }
  });
}
