import type { Exclusion } from '../../../shared/plan/plan-schema';
import { addExclusion, boxOf, cmd, deleteExclusion, moveExclusion, resizeExclusion } from '../commands';
import { pxToMm, type ScreenPt } from '../geometry/coords';
import { exclusionBox, hitBoxHandle, hitExclusion, type BoxHandle } from './hit-test';
import { createPanner } from './pan';
import { snapPoint } from './snap';
import { DRAG_THRESHOLD_PX, hitPx, type Tool, type ToolContext, type ToolPointer } from './tool';

type State =
  | { name: 'idle' }
  | { name: 'pointing-exclusion'; index: number; down: ScreenPt; start: [number, number] }
  | { name: 'dragging-exclusion'; index: number; start: [number, number]; applied: [number, number] }
  | { name: 'dragging-handle'; index: number; handle: BoxHandle }
  | { name: 'pointing-new'; down: ScreenPt; start: [number, number] }
  | { name: 'drawing-rect'; start: [number, number] }
  | { name: 'drawing-polygon' }
  | { name: 'panning' };

/**
 * Exclusions step. Press on an exclusion to select and drag it; drag a selected one's corner
 * handle to resize; press on empty paper and drag to draw a rectangle of the chosen kind; a
 * downlight is placed with a click; in polygon mode clicks place corners and Enter (or a click
 * on the first corner) closes the shape. Delete removes the selected exclusion.
 */
export function createExclusionsTool(): Tool {
  let s: State = { name: 'idle' };
  const panner = createPanner();
  const snap = (ctx: ToolContext, e: ToolPointer) => snapPoint(ctx, e, ctx.store.getState().plan);

  const commitPolygon = (ctx: ToolContext) => {
    const { session } = ctx.store.getState();
    const pts = session.draft?.points ?? [];
    s = { name: 'idle' };
    ctx.store.setSession({ draft: null });
    if (pts.length >= 3) {
      const ok = ctx.store.dispatch(cmd(`add ${session.exclusionKind}`, addExclusion, { exclusion: { kind: session.exclusionKind, polygon: pts } }));
      if (ok) ctx.store.setSession({ selection: { kind: 'exclusion', index: ctx.store.getState().plan.exclusions.length - 1 } });
    }
  };

  return {
    id: 'exclusions',
    state: () => s.name,
    pointerDown(ctx, e) {
      const { plan, session } = ctx.store.getState();
      const tol = pxToMm(ctx.camera(), hitPx(e));
      if (s.name === 'drawing-polygon') {
        const pts = session.draft?.points ?? [];
        const p = snap(ctx, e);
        if (pts.length >= 3 && Math.hypot(e.world.x - pts[0][0], e.world.y - pts[0][1]) <= tol) return commitPolygon(ctx);
        ctx.store.setSession({ draft: { kind: 'exclusion-polygon', points: [...pts, p], cursor: p } });
        return;
      }
      const sel = session.selection;
      if (sel?.kind === 'exclusion' && plan.exclusions[sel.index]) {
        const handle = hitBoxHandle(plan.exclusions[sel.index], e.world, tol);
        if (handle) {
          ctx.store.beginGesture(`resize ${plan.exclusions[sel.index].kind}`);
          s = { name: 'dragging-handle', index: sel.index, handle };
          return;
        }
      }
      const hit = hitExclusion(plan, e.world, tol);
      if (hit >= 0) {
        ctx.store.setSession({ selection: { kind: 'exclusion', index: hit } });
        s = { name: 'pointing-exclusion', index: hit, down: e.screen, start: snap(ctx, e) };
        return;
      }
      ctx.store.setSession({ selection: null });
      if (e.button !== 0) {
        s = { name: 'panning' };
        panner.start(e.screen);
        return;
      }
      if (session.exclusionKind === 'downlight') {
        const at = snap(ctx, e);
        if (ctx.store.dispatch(cmd('add downlight', addExclusion, { exclusion: { kind: 'downlight', at } }))) {
          ctx.store.setSession({ selection: { kind: 'exclusion', index: ctx.store.getState().plan.exclusions.length - 1 } });
        }
        return;
      }
      if (session.exclusionShape === 'polygon') {
        const p = snap(ctx, e);
        s = { name: 'drawing-polygon' };
        ctx.store.setSession({ draft: { kind: 'exclusion-polygon', points: [p], cursor: p } });
        return;
      }
      s = { name: 'pointing-new', down: e.screen, start: snap(ctx, e) };
    },
    pointerMove(ctx, e) {
      const { plan, session } = ctx.store.getState();
      const far = (down: ScreenPt) => Math.hypot(e.screen.x - down.x, e.screen.y - down.y) >= DRAG_THRESHOLD_PX;
      if (s.name === 'panning') return panner.move(ctx, e.screen);
      if (s.name === 'drawing-polygon') {
        const cursor = snap(ctx, e);
        ctx.store.setSession({ draft: { kind: 'exclusion-polygon', points: session.draft?.points ?? [], cursor } });
        return;
      }
      if (s.name === 'pointing-new' && far(s.down)) s = { name: 'drawing-rect', start: s.start };
      if (s.name === 'drawing-rect') {
        const p = snap(ctx, e);
        ctx.store.setSession({ draft: { kind: 'exclusion-rect', points: [s.start, p], cursor: p } });
        return;
      }
      if (s.name === 'pointing-exclusion' && far(s.down)) {
        ctx.store.beginGesture(`move ${plan.exclusions[s.index].kind}`);
        s = { name: 'dragging-exclusion', index: s.index, start: s.start, applied: [0, 0] };
      }
      if (s.name === 'dragging-exclusion') {
        const p = snap(ctx, e);
        // Move by what is left of the total offset from the press, so snapping never drifts.
        const dx = p[0] - s.start[0] - s.applied[0];
        const dy = p[1] - s.start[1] - s.applied[1];
        if (dx === 0 && dy === 0) return;
        if (ctx.store.dispatch(cmd('move exclusion', moveExclusion, { index: s.index, dx, dy }), { history: 'gesture' })) {
          s.applied = [s.applied[0] + dx, s.applied[1] + dy];
        }
        return;
      }
      if (s.name === 'dragging-handle') {
        const ex = plan.exclusions[s.index];
        const b = exclusionBox(ex)!;
        const [x, y] = snap(ctx, e);
        const box = { ...b };
        if (s.handle.includes('w')) box.minX = x;
        else box.maxX = x;
        if (s.handle.includes('n')) box.minY = y;
        else box.maxY = y;
        ctx.store.dispatch(cmd(`resize ${ex.kind}`, resizeExclusion, { index: s.index, box }), { history: 'gesture' });
      }
    },
    pointerUp(ctx) {
      const { session } = ctx.store.getState();
      if (s.name === 'drawing-polygon') return;
      if (s.name === 'drawing-rect') {
        const [a, b] = session.draft?.points ?? [];
        ctx.store.setSession({ draft: null });
        if (a && b) {
          const bx = boxOf([a, b]);
          const exclusion: Exclusion = {
            kind: session.exclusionKind,
            polygon: [
              [bx.minX, bx.minY],
              [bx.maxX, bx.minY],
              [bx.maxX, bx.maxY],
              [bx.minX, bx.maxY],
            ],
          };
          if (bx.maxX - bx.minX >= 10 && bx.maxY - bx.minY >= 10 && ctx.store.dispatch(cmd(`add ${exclusion.kind}`, addExclusion, { exclusion }))) {
            ctx.store.setSession({ selection: { kind: 'exclusion', index: ctx.store.getState().plan.exclusions.length - 1 } });
          }
        }
      }
      if (s.name === 'dragging-exclusion' || s.name === 'dragging-handle') ctx.store.endGesture();
      panner.end();
      s = { name: 'idle' };
    },
    keyDown(ctx, k) {
      const { session, plan } = ctx.store.getState();
      if (s.name === 'drawing-polygon' && k.key === 'Enter') {
        commitPolygon(ctx);
        return true;
      }
      if (k.key === 'Escape' && s.name !== 'idle') {
        this.cancel(ctx);
        return true;
      }
      if ((k.key === 'Delete' || k.key === 'Backspace') && session.selection?.kind === 'exclusion') {
        const i = session.selection.index;
        if (i < plan.exclusions.length) ctx.store.dispatch(cmd(`delete ${plan.exclusions[i].kind}`, deleteExclusion, { index: i }));
        ctx.store.setSession({ selection: null });
        return true;
      }
      return false;
    },
    cancel(ctx) {
      if (s.name === 'dragging-exclusion' || s.name === 'dragging-handle') ctx.store.cancelGesture();
      panner.end();
      s = { name: 'idle' };
      ctx.store.setSession({ draft: null });
    },
  };
}
