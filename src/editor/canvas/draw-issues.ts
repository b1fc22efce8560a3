import type { Plan } from '../../../shared/plan/plan-schema';
import type { PlanMessage } from '../../../shared/plan/plan-messages';
import { boxOf } from '../commands/resize-exclusion';
import { sx, sy, type DrawContext } from './draw-context';
import { PALETTE, SANS } from './palette';

/** A validation message with the place on the plan (mm) where it belongs. */
export type PlacedIssue = { severity: 'error' | 'warning'; message: string; at: [number, number]; code: string };

/** Where an engine message belongs: its own `at`, else the edge's middle, the point, the exclusion. */
export function placeMessage(plan: Plan, m: PlanMessage, severity: PlacedIssue['severity']): PlacedIssue | null {
  let at: [number, number] | null = m.at ?? null;
  const ex = m.exclusionIndex !== undefined ? plan.exclusions[m.exclusionIndex] : undefined;
  const ring = ex?.polygon ?? (ex ? null : plan.outline);
  if (!at && ring && m.edgeIndex !== undefined && ring[m.edgeIndex]) {
    const a = ring[m.edgeIndex],
      b = ring[(m.edgeIndex + 1) % ring.length];
    at = [(a[0] + b[0]) / 2, (a[1] + b[1]) / 2];
  }
  if (!at && ring && m.pointIndex !== undefined && ring[m.pointIndex]) at = [ring[m.pointIndex][0], ring[m.pointIndex][1]];
  if (!at && ex) {
    if (ex.at) at = [ex.at[0], ex.at[1]];
    else if (ex.polygon) {
      const b = boxOf(ex.polygon);
      at = [(b.minX + b.maxX) / 2, (b.minY + b.maxY) / 2];
    }
  }
  return at ? { severity, message: m.message, at, code: m.code } : null;
}

/** A numbered marker at each placed message, with the message beside it. */
export function drawIssues(d: DrawContext, issues: PlacedIssue[]) {
  const { ctx, cam } = d;
  ctx.font = `500 11px ${SANS}`;
  ctx.textBaseline = 'middle';
  issues.slice(0, 12).forEach((m, i) => {
    const x = sx(cam, m.at[0]),
      y = sy(cam, m.at[1]);
    const colour = m.severity === 'error' ? PALETTE.brick : PALETTE.strawDark;
    ctx.beginPath();
    ctx.arc(x, y, 9, 0, Math.PI * 2);
    ctx.fillStyle = colour;
    ctx.fill();
    ctx.fillStyle = '#fff';
    ctx.textAlign = 'center';
    ctx.fillText(m.severity === 'error' ? '!' : String(i + 1), x, y + 0.5);
    const text = m.message.length > 70 ? m.message.slice(0, 68) + '…' : m.message;
    const w = ctx.measureText(text).width;
    // Beside the marker on the right, or on the left where the right would leave the view.
    const left = x + 12 + w + 10 > d.width ? x - 12 - w - 10 : x + 12;
    ctx.fillStyle = 'rgba(255,255,255,0.95)';
    ctx.fillRect(left, y - 9, w + 10, 18);
    ctx.strokeStyle = colour;
    ctx.lineWidth = 1;
    ctx.strokeRect(left, y - 9, w + 10, 18);
    ctx.fillStyle = colour;
    ctx.textAlign = 'left';
    ctx.fillText(text, left + 5, y + 0.5);
  });
}
