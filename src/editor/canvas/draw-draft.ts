import type { Plan } from '../../../shared/plan/plan-schema';
import { formatLength } from '../geometry/units';
import type { Session } from '../store/session';
import { sx, sy, type DrawContext } from './draw-context';
import { MONO, PALETTE } from './palette';

/** The shape being drawn: rubber band from the last corner, rectangles, calibration points. */
export function drawDraft(d: DrawContext, plan: Plan, session: Session) {
  const { ctx, cam } = d;
  const draft = session.draft;
  if (session.calibration) {
    const { a, b } = session.calibration;
    ctx.beginPath();
    ctx.moveTo(sx(cam, a[0]), sy(cam, a[1]));
    ctx.lineTo(sx(cam, b[0]), sy(cam, b[1]));
    ctx.strokeStyle = PALETTE.select;
    ctx.lineWidth = 2;
    ctx.stroke();
  }
  if (!draft) return;
  ctx.setLineDash([6, 4]);
  ctx.lineWidth = 1.5;
  ctx.strokeStyle = PALETTE.select;
  ctx.beginPath();
  if (draft.kind === 'outline' && draft.cursor && plan.outline.length > 0) {
    const last = plan.outline[plan.outline.length - 1];
    ctx.moveTo(sx(cam, last[0]), sy(cam, last[1]));
    ctx.lineTo(sx(cam, draft.cursor[0]), sy(cam, draft.cursor[1]));
    const len = Math.hypot(draft.cursor[0] - last[0], draft.cursor[1] - last[1]);
    ctx.stroke();
    ctx.setLineDash([]);
    ctx.font = `500 11px ${MONO}`;
    ctx.fillStyle = PALETTE.select;
    ctx.fillText(formatLength(len, session.units), sx(cam, draft.cursor[0]) + 10, sy(cam, draft.cursor[1]) - 10);
    return;
  }
  if (draft.kind === 'exclusion-rect' && draft.points.length === 2) {
    const [a, b] = draft.points;
    ctx.rect(sx(cam, a[0]), sy(cam, a[1]), (b[0] - a[0]) * cam.zoom, (b[1] - a[1]) * cam.zoom);
  }
  if (draft.kind === 'exclusion-polygon' || draft.kind === 'calibrate') {
    const pts = draft.cursor ? [...draft.points, draft.cursor] : draft.points;
    pts.forEach(([x, y], i) => (i ? ctx.lineTo(sx(cam, x), sy(cam, y)) : ctx.moveTo(sx(cam, x), sy(cam, y))));
    for (const [x, y] of draft.points) {
      ctx.moveTo(sx(cam, x) + 4, sy(cam, y));
      ctx.arc(sx(cam, x), sy(cam, y), 4, 0, Math.PI * 2);
    }
  }
  ctx.stroke();
  ctx.setLineDash([]);
  if (session.calibration) {
    const { a, b } = session.calibration;
    ctx.beginPath();
    ctx.moveTo(sx(cam, a[0]), sy(cam, a[1]));
    ctx.lineTo(sx(cam, b[0]), sy(cam, b[1]));
    ctx.strokeStyle = PALETTE.select;
    ctx.stroke();
  }
}
