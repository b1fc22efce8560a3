import type { Plan } from '../../../shared/plan/plan-schema';
import { boxOf } from '../commands/resize-exclusion';
import { hatch, sx, sy, traceRing, type DrawContext } from './draw-context';
import { KIND_STYLES, PALETTE, SANS } from './palette';

type Box = { minX: number; minY: number; maxX: number; maxY: number };

/**
 * Exclusions, each kind in its own colour and hatch (KIND_STYLES, the same as the kind buttons).
 * Every one keeps a readable 11 px label: inside when it fits, otherwise beside the shape on a
 * short leader line (to the right, or the left near the canvas edge).
 */
export function drawExclusions(d: DrawContext, plan: Plan, selected: number | null) {
  const { ctx, cam } = d;
  plan.exclusions.forEach((e, i) => {
    const st = KIND_STYLES[e.kind];
    const isSel = selected === i;
    const text = e.label ?? st.name.toLowerCase();
    if (e.at) {
      const x = sx(cam, e.at[0]),
        y = sy(cam, e.at[1]);
      const r = Math.max(6, 50 * cam.zoom);
      ctx.beginPath();
      ctx.arc(x, y, r, 0, Math.PI * 2);
      ctx.fillStyle = st.fill;
      ctx.fill();
      ctx.moveTo(x - r * 0.7, y - r * 0.7);
      ctx.lineTo(x + r * 0.7, y + r * 0.7);
      ctx.moveTo(x + r * 0.7, y - r * 0.7);
      ctx.lineTo(x - r * 0.7, y + r * 0.7);
      ctx.strokeStyle = isSel ? PALETTE.select : st.ink;
      ctx.lineWidth = isSel ? 2.5 : 1.5;
      ctx.stroke();
      if (e.label || isSel) label(d, text, st.ink, { minX: x - r, minY: y - r, maxX: x + r, maxY: y + r }, true);
      return;
    }
    const poly = e.polygon!;
    const b = boxOf(poly);
    const box = { minX: sx(cam, b.minX), minY: sy(cam, b.minY), maxX: sx(cam, b.maxX), maxY: sy(cam, b.maxY) };
    ctx.save();
    ctx.beginPath();
    traceRing(d, poly);
    ctx.fillStyle = st.fill;
    ctx.globalAlpha = 0.6;
    ctx.fill();
    ctx.globalAlpha = 1;
    ctx.clip();
    ctx.beginPath();
    for (const a of st.angles) hatch(d, box, a, st.spacingPx);
    ctx.strokeStyle = st.ink;
    ctx.lineWidth = 1;
    ctx.stroke();
    ctx.restore();
    ctx.beginPath();
    traceRing(d, poly);
    ctx.setLineDash(st.dash);
    ctx.strokeStyle = isSel ? PALETTE.select : st.ink;
    ctx.lineWidth = isSel ? 2.5 : 1.5;
    ctx.stroke();
    ctx.setLineDash([]);
    label(d, text, st.ink, box, false);
  });
}

const FONT = `600 11px ${SANS}`;
const PAD = 3;

function label(d: DrawContext, text: string, ink: string, box: Box, forceOutside: boolean) {
  const { ctx } = d;
  ctx.font = FONT;
  const tw = ctx.measureText(text).width;
  const w = box.maxX - box.minX,
    h = box.maxY - box.minY;
  const cy = (box.minY + box.maxY) / 2;
  ctx.textBaseline = 'middle';
  if (!forceOutside && tw + 2 * PAD + 4 <= w && h >= 18) {
    const cx = (box.minX + box.maxX) / 2;
    ctx.fillStyle = 'rgba(250,247,240,0.9)';
    ctx.fillRect(cx - tw / 2 - PAD, cy - 8, tw + 2 * PAD, 16);
    ctx.fillStyle = ink;
    ctx.textAlign = 'center';
    ctx.fillText(text, cx, cy);
    return;
  }
  // Beside the shape, on a 10 px leader; on the left when the right would run off the canvas.
  const right = box.maxX + 10 + tw + 2 * PAD <= d.width - 4 || box.minX - 10 - tw - 2 * PAD < 4;
  const edge = right ? box.maxX : box.minX;
  const tx = right ? edge + 10 : edge - 10 - tw - 2 * PAD;
  ctx.beginPath();
  ctx.moveTo(edge, cy);
  ctx.lineTo(right ? tx : tx + tw + 2 * PAD, cy);
  ctx.strokeStyle = ink;
  ctx.lineWidth = 1;
  ctx.stroke();
  ctx.fillStyle = 'rgba(250,247,240,0.95)';
  ctx.fillRect(tx, cy - 8, tw + 2 * PAD, 16);
  ctx.strokeRect(tx + 0.5, cy - 7.5, tw + 2 * PAD - 1, 15);
  ctx.fillStyle = ink;
  ctx.textAlign = 'left';
  ctx.fillText(text, tx + PAD, cy);
}
