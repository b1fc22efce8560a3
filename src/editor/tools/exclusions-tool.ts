import type { Exclusion } from '../../../shared/plan/plan-schema';
import { addExclusion, boxOf, cmd, deleteExclusion, moveExclusion, resizeExclusion } from '../commands';
import { pxToMm, type ScreenPt } from '../geometry/coords';
import { exclusionBox, hitBoxHandle, hitExclusion, type BoxHandle } from './hit-test';
import { createPanner } from './pan';
import { snapPoint } from './snap';
import { DRAG_THRESHOLD_PX, hitPx, type Tool, type ToolContext, type ToolPointer } from './tool';

/** What is being drawn between clicks: a rectangle's first corner, or a polygon's corners so far. */
type Drawing = { kind: 'rect'; start: [number, number] } | { kind: 'polygon' } | null;

type State =
  | { name: 'idle' }
  | { name: 'pointing-exclusion'; index: number; down: ScreenPt; start: [number, number] }
  | { name: 'dragging-exclusion'; index: number; start: [number, number]; applied: [number, number] }
  | { name: 'dragging-handle'; index: number; handle: BoxHandle }
  | { name: 'pointing-paper'; down: ScreenPt }
  | { name: 'panning' };

/** Smallest rectangle side (mm) worth recording; a smaller one is a slip of the hand. */
const MIN_RECT_MM = 10;

/**
 * Exclusions step. Dragging empty paper pans, as everywhere else. Drawing is by clicks only:
 * a rectangle is two clicks on opposite corners (the preview follows the pointer between them),
 * a polygon is a click per corner closed by Enter or a click on its first corner, a downlight is
 * one click. Press on an exclusion to select and drag it; drag a selected one's corner handle to
 * resize; Delete removes the selected exclusion; Escape abandons the shape being drawn.
 */
export function createExclusionsTool(): Tool {
  let s: State = { name: 'idle' };
  let drawing: Drawing = null;
  const panner = createPanner();
  const snap = (ctx: ToolContext, e: ToolPointer) => snapPoint(ctx, e, ctx.store.getState().plan);

  const select = (ctx: ToolContext) => ctx.store.setSession({ selection: { kind: 'exclusion', index: ctx.store.getState().plan.exclusions.length - 1 } });

  const stopDrawing = (ctx: ToolContext) => {
    drawing = null;
    ctx.store.setSession({ draft: null });
  };

  const commitPolygon = (ctx: ToolContext) => {
    const { session } = ctx.store.getState();
    const pts = session.draft?.points ?? [];
    stopDrawing(ctx);
    if (
      pts.length >= 3 &&
      ctx.store.dispatch(cmd(`add ${session.exclusionKind}`, addExclusion, { exclusion: { kind: session.exclusionKind, polygon: pts } }))
    ) {
      select(ctx);
    }
  };

  const commitRect = (ctx: ToolContext, a: [number, number], b: [number, number]) => {
    const { session } = ctx.store.getState();
    const bx = boxOf([a, b]);
    if (bx.maxX - bx.minX < MIN_RECT_MM || bx.maxY - bx.minY < MIN_RECT_MM) return false; // same spot twice: keep waiting
    stopDrawing(ctx);
    const exclusion: Exclusion = {
      kind: session.exclusionKind,
      polygon: [
        [bx.minX, bx.minY],
        [bx.maxX, bx.minY],
        [bx.maxX, bx.maxY],
        [bx.minX, bx.maxY],
      ],
    };
    if (ctx.store.dispatch(cmd(`add ${exclusion.kind}`, addExclusion, { exclusion }))) select(ctx);
    return true;
  };

  /** A click (press and release without a drag) on the paper, or anywhere while drawing. */
  const click = (ctx: ToolContext, e: ToolPointer) => {
    const { session } = ctx.store.getState();
    const p = snap(ctx, e);
    if (drawing?.kind === 'rect') {
      commitRect(ctx, drawing.start, p);
      return;
    }
    if (drawing?.kind === 'polygon') {
      const pts = session.draft?.points ?? [];
      const tol = pxToMm(ctx.camera(), hitPx(e));
      if (pts.length >= 3 && Math.hypot(e.world.x - pts[0][0], e.world.y - pts[0][1]) <= tol) return commitPolygon(ctx);
      ctx.store.setSession({ draft: { kind: 'exclusion-polygon', points: [...pts, p], cursor: p } });
      return;
    }
    ctx.store.setSession({ selection: null });
    if (session.exclusionKind === 'downlight') {
      if (ctx.store.dispatch(cmd('add downlight', addExclusion, { exclusion: { kind: 'downlight', at: p } }))) select(ctx);
      return;
    }
    if (session.exclusionShape === 'polygon') {
      drawing = { kind: 'polygon' };
      ctx.store.setSession({ draft: { kind: 'exclusion-polygon', points: [p], cursor: p } });
      return;
    }
    drawing = { kind: 'rect', start: p };
    ctx.store.setSession({ draft: { kind: 'exclusion-rect', points: [p, p], cursor: p } });
  };

  return {
    id: 'exclusions',
    state: () => (s.name === 'idle' && drawing ? `drawing-${drawing.kind}` : s.name),
    pointerDown(ctx, e) {
      const { plan, session } = ctx.store.getState();
      const tol = pxToMm(ctx.camera(), hitPx(e));
      if (e.button !== 0) {
        s = { name: 'panning' };
        panner.start(e.screen);
        return;
      }
      if (!drawing) {
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
      }
      // Paper (or anywhere while drawing): a click draws, a drag pans; which one is known on release.
      s = { name: 'pointing-paper', down: e.screen };
      panner.start(e.screen);
    },
    pointerMove(ctx, e) {
      const { plan, session } = ctx.store.getState();
      const far = (down: ScreenPt) => Math.hypot(e.screen.x - down.x, e.screen.y - down.y) >= DRAG_THRESHOLD_PX;
      if (s.name === 'pointing-paper' && far(s.down)) s = { name: 'panning' };
      if (s.name === 'panning') {
        panner.move(ctx, e.screen);
        return;
      }
      if (s.name === 'idle' || s.name === 'pointing-paper') {
        if (!drawing) return;
        const cursor = snap(ctx, e);
        const draft =
          drawing.kind === 'rect'
            ? { kind: 'exclusion-rect' as const, points: [drawing.start, cursor], cursor }
            : { kind: 'exclusion-polygon' as const, points: session.draft?.points ?? [], cursor };
        ctx.store.setSession({ draft });
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
    pointerUp(ctx, e) {
      if (s.name === 'pointing-paper') click(ctx, e);
      if (s.name === 'dragging-exclusion' || s.name === 'dragging-handle') ctx.store.endGesture();
      panner.end();
      s = { name: 'idle' };
    },
    keyDown(ctx, k) {
      const { session, plan } = ctx.store.getState();
      if (drawing?.kind === 'polygon' && k.key === 'Enter') {
        commitPolygon(ctx);
        return true;
      }
      if (k.key === 'Escape' && (s.name !== 'idle' || drawing)) {
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
      stopDrawing(ctx);
    },
  };
}
