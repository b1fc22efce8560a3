import type { Plan } from '../../../shared/plan/plan-schema';
import { boxOf } from '../commands/resize-exclusion';
import type { Session } from '../store/session';
import { edgeMidpoint } from '../tools/hit-test';
import { MIN_EDGE_PX_FOR_MIDPOINT } from '../tools/tool';
import { sx, sy, type DrawContext } from './draw-context';
import { PALETTE } from './palette';

export function edgeScreenLength(plan: Plan, i: number, zoom: number): number {
  const a = plan.outline[i];
  const b = plan.outline[(i + 1) % plan.outline.length];
  return Math.hypot(b[0] - a[0], b[1] - a[1]) * zoom;
}

function minEdgeScreenLength(plan: Plan, zoom: number): number {
  let m = Infinity;
  for (let i = 0; i < plan.outline.length; i++) m = Math.min(m, edgeScreenLength(plan, i, zoom));
  return m;
}

/** Corner handles and "insert" midpoints (outline step), resize handles of a selected exclusion. */
export function drawHandles(d: DrawContext, plan: Plan, session: Session) {
  const { ctx, cam } = d;
  const sel = session.selection;
  if (session.step === 'outline') {
    const n = plan.outline.length;
    if (n >= 3 && !session.draft) {
      ctx.beginPath();
      for (let i = 0; i < n; i++) {
        // Only on edges long enough on screen to hold a handle between their corners.
        if (edgeScreenLength(plan, i, cam.zoom) < MIN_EDGE_PX_FOR_MIDPOINT) continue;
        const [x, y] = edgeMidpoint(plan, i);
        ctx.moveTo(sx(cam, x) + 4, sy(cam, y));
        ctx.arc(sx(cam, x), sy(cam, y), 4, 0, Math.PI * 2);
      }
      ctx.fillStyle = PALETTE.paper;
      ctx.fill();
      ctx.strokeStyle = PALETTE.graphiteFaint;
      ctx.lineWidth = 1.5;
      ctx.stroke();
    }
    // Smaller corner handles when corners crowd together on screen.
    const half = n > 0 && minEdgeScreenLength(plan, cam.zoom) < 14 ? 2.5 : 5;
    plan.outline.forEach(([x, y], i) => {
      const on = sel?.kind === 'corner' && sel.index === i;
      ctx.beginPath();
      ctx.rect(sx(cam, x) - half, sy(cam, y) - half, half * 2, half * 2);
      ctx.fillStyle = on ? PALETTE.select : PALETTE.paper;
      ctx.fill();
      ctx.strokeStyle = on ? PALETTE.select : PALETTE.graphite;
      ctx.lineWidth = 1.5;
      ctx.stroke();
    });
  }
  if (session.step === 'exclusions' && sel?.kind === 'exclusion') {
    const e = plan.exclusions[sel.index];
    if (e?.polygon) {
      const b = boxOf(e.polygon);
      ctx.beginPath();
      for (const [x, y] of [
        [b.minX, b.minY],
        [b.maxX, b.minY],
        [b.maxX, b.maxY],
        [b.minX, b.maxY],
      ]) {
        ctx.rect(sx(cam, x) - 5, sy(cam, y) - 5, 10, 10);
      }
      ctx.fillStyle = PALETTE.paper;
      ctx.fill();
      ctx.strokeStyle = PALETTE.select;
      ctx.lineWidth = 1.5;
      ctx.stroke();
    }
  }
}
