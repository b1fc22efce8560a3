import type { Plan } from '../../../shared/plan/plan-schema';
import { outwardNormal } from '../geometry/lines';
import { formatLength } from '../geometry/units';
import type { Units } from '../store/session';
import { sx, sy, traceRing, type DrawContext } from './draw-context';
import { MONO, PALETTE } from './palette';

/** The graphite outline with each edge's length in JetBrains Mono just outside it. */
export function drawOutline(d: DrawContext, plan: Plan, units: Units, selectedEdge: number | null) {
  const { ctx, cam } = d;
  const ring = plan.outline;
  const n = ring.length;
  if (n === 0) return;
  ctx.beginPath();
  if (n >= 3) traceRing(d, ring);
  else ring.forEach(([x, y], i) => (i ? ctx.lineTo(sx(cam, x), sy(cam, y)) : ctx.moveTo(sx(cam, x), sy(cam, y))));
  ctx.strokeStyle = PALETTE.graphite;
  ctx.lineWidth = 2.5;
  ctx.lineJoin = 'round';
  ctx.stroke();
  if (selectedEdge !== null && selectedEdge < n && n >= 2) {
    const a = ring[selectedEdge],
      b = ring[(selectedEdge + 1) % n];
    ctx.beginPath();
    ctx.moveTo(sx(cam, a[0]), sy(cam, a[1]));
    ctx.lineTo(sx(cam, b[0]), sy(cam, b[1]));
    ctx.strokeStyle = PALETTE.select;
    ctx.lineWidth = 4;
    ctx.stroke();
  }
  const edges = n >= 3 ? n : n - 1;
  ctx.font = `500 11px ${MONO}`;
  ctx.textAlign = 'center';
  ctx.textBaseline = 'middle';
  for (let i = 0; i < edges; i++) {
    const a = ring[i],
      b = ring[(i + 1) % n];
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    if (len * cam.zoom < 24) continue;
    const [ox, oy] = n >= 3 ? outwardNormal(ring, i) : [0, -1];
    const text = formatLength(len, units);
    const w = ctx.measureText(text).width + 8;
    // Far enough out that the label clears the edge and its midpoint handle, whatever its slope.
    const off = 8 + Math.abs(ox) * (w / 2) + Math.abs(oy) * 8;
    const x = sx(cam, (a[0] + b[0]) / 2) + ox * off;
    const y = sy(cam, (a[1] + b[1]) / 2) + oy * off;
    ctx.fillStyle = 'rgba(250,247,240,0.92)';
    ctx.fillRect(x - w / 2, y - 8, w, 16);
    ctx.fillStyle = i === selectedEdge ? PALETTE.select : PALETTE.graphite;
    ctx.fillText(text, x, y);
  }
}
