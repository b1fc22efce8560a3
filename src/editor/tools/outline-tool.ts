import { addCorner, cmd, deleteCorner, insertCorner, moveCorner } from '../commands';
import { pxToMm, type ScreenPt } from '../geometry/coords';
import { edgeMidpoint, hitCorner, hitEdge, hitEdgeMidpoint } from './hit-test';
import { createPanner } from './pan';
import { snapPoint } from './snap';
import { DRAG_THRESHOLD_PX, hitPx, MIN_EDGE_PX_FOR_MIDPOINT, type Tool, type ToolContext } from './tool';

type State =
  | { name: 'idle' }
  | { name: 'drawing' }
  | { name: 'pointing-corner'; index: number; down: ScreenPt }
  | { name: 'pointing-midpoint'; edge: number; down: ScreenPt }
  | { name: 'dragging-corner'; index: number }
  | { name: 'panning' };

/**
 * Outline step. With no outline, clicks place corners (each one undoable) until the first corner
 * is clicked again or Enter is pressed. With an outline: drag corners; click anywhere on a wall,
 * its middle handle included, to select it (its length can then be typed); drag the middle
 * handle to insert a corner there (only a drag past DRAG_THRESHOLD_PX inserts one); Delete removes
 * the selected corner.
 */
export function createOutlineTool(): Tool {
  let s: State = { name: 'idle' };
  const panner = createPanner();

  const finishDrawing = (ctx: ToolContext) => {
    s = { name: 'idle' };
    ctx.store.setSession({ draft: null });
  };

  return {
    id: 'outline',
    state: () => s.name,
    pointerDown(ctx, e) {
      const { plan } = ctx.store.getState();
      const tol = pxToMm(ctx.camera(), hitPx(e));
      if (s.name === 'idle' && plan.outline.length < 3) s = { name: 'drawing' };
      if (s.name === 'drawing') {
        const n = plan.outline.length;
        if (n >= 3 && hitCorner(plan, e.world, tol) === 0) return finishDrawing(ctx);
        const at = snapPoint(ctx, e, plan, { from: n > 0 ? plan.outline[n - 1] : undefined });
        const last = plan.outline[n - 1];
        if (last && last[0] === at[0] && last[1] === at[1]) return; // a double click: same corner twice
        ctx.store.dispatch(cmd(`add corner ${n + 1}`, addCorner, { at }));
        ctx.store.setSession({ draft: { kind: 'outline', points: [], cursor: at }, selection: { kind: 'corner', index: n } });
        return;
      }
      const corner = hitCorner(plan, e.world, tol);
      if (corner >= 0) {
        s = { name: 'pointing-corner', index: corner, down: e.screen };
        ctx.store.setSession({ selection: { kind: 'corner', index: corner } });
        return;
      }
      const mid = hitEdgeMidpoint(plan, e.world, tol, pxToMm(ctx.camera(), MIN_EDGE_PX_FOR_MIDPOINT));
      if (mid >= 0) {
        s = { name: 'pointing-midpoint', edge: mid, down: e.screen };
        ctx.store.setSession({ selection: { kind: 'edge', index: mid } });
        return;
      }
      const edge = hitEdge(plan, e.world, tol);
      if (edge) {
        ctx.store.setSession({ selection: { kind: 'edge', index: edge.edge } });
        return;
      }
      ctx.store.setSession({ selection: null });
      s = { name: 'panning' };
      panner.start(e.screen);
    },
    pointerMove(ctx, e) {
      const { plan } = ctx.store.getState();
      if (s.name === 'drawing') {
        const n = plan.outline.length;
        const cursor = snapPoint(ctx, e, plan, { from: n > 0 ? plan.outline[n - 1] : undefined });
        ctx.store.setSession({ draft: { kind: 'outline', points: [], cursor } });
        return;
      }
      if (s.name === 'panning') return panner.move(ctx, e.screen);
      if (s.name === 'pointing-midpoint') {
        if (Math.hypot(e.screen.x - s.down.x, e.screen.y - s.down.y) < DRAG_THRESHOLD_PX) return;
        ctx.store.beginGesture(`insert corner on edge ${s.edge + 1}`);
        ctx.store.dispatch(cmd('insert corner', insertCorner, { edge: s.edge, at: edgeMidpoint(plan, s.edge) }), { history: 'gesture' });
        s = { name: 'dragging-corner', index: s.edge + 1 };
        ctx.store.setSession({ selection: { kind: 'corner', index: s.index } });
      }
      if (s.name === 'pointing-corner') {
        if (Math.hypot(e.screen.x - s.down.x, e.screen.y - s.down.y) < DRAG_THRESHOLD_PX) return;
        ctx.store.beginGesture(`move corner ${s.index + 1}`);
        s = { name: 'dragging-corner', index: s.index };
      }
      if (s.name === 'dragging-corner') {
        const to = snapPoint(ctx, e, plan, { ignoreCorner: s.index });
        ctx.store.dispatch(cmd(`move corner ${s.index + 1}`, moveCorner, { index: s.index, to }), { history: 'gesture' });
      }
    },
    pointerUp(ctx) {
      if (s.name === 'dragging-corner') ctx.store.endGesture();
      if (s.name === 'panning') panner.end();
      if (s.name !== 'drawing') s = { name: 'idle' };
    },
    keyDown(ctx, k) {
      const { session, plan } = ctx.store.getState();
      if (s.name === 'drawing' && (k.key === 'Enter' || k.key === 'Escape')) {
        finishDrawing(ctx);
        return true;
      }
      if (k.key === 'Escape' && s.name === 'dragging-corner') {
        ctx.store.cancelGesture();
        s = { name: 'idle' };
        return true;
      }
      if ((k.key === 'Delete' || k.key === 'Backspace') && session.selection?.kind === 'corner') {
        const i = session.selection.index;
        if (i < plan.outline.length) {
          ctx.store.dispatch(cmd(`delete corner ${i + 1}`, deleteCorner, { index: i }));
          ctx.store.setSession({ selection: null });
        }
        return true;
      }
      return false;
    },
    cancel(ctx) {
      if (s.name === 'dragging-corner') ctx.store.cancelGesture();
      panner.end();
      s = { name: 'idle' };
      ctx.store.setSession({ draft: null });
    },
  };
}
