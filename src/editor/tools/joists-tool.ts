import { cmd, moveJoistOffset, setJoistsAlongEdge } from '../commands';
import { pxToMm, type ScreenPt } from '../geometry/coords';
import { distanceToJoistMm, hitEdge, joistNormal } from './hit-test';
import { createPanner } from './pan';
import { DRAG_THRESHOLD_PX, hitPx, type Tool } from './tool';

type State =
  | { name: 'idle' }
  | { name: 'pointing-edge'; edge: number }
  | { name: 'pointing-joist'; down: ScreenPt; startOffset: number; startDot: number }
  | { name: 'dragging-joist'; startOffset: number; startDot: number }
  | { name: 'panning' };

/**
 * Joists step: click an outline edge to run the joists parallel to it; drag a joist to place the
 * first joist (snaps to 10 mm, Alt for 1 mm). Dragging empty paper pans.
 */
export function createJoistsTool(): Tool {
  let s: State = { name: 'idle' };
  const panner = createPanner();
  return {
    id: 'joists',
    state: () => s.name,
    pointerDown(ctx, e) {
      const { plan } = ctx.store.getState();
      const tol = pxToMm(ctx.camera(), hitPx(e));
      const edge = hitEdge(plan, e.world, tol);
      if (edge) {
        s = { name: 'pointing-edge', edge: edge.edge };
        return;
      }
      if (distanceToJoistMm(plan, e.world) <= tol) {
        const [nx, ny] = joistNormal(plan.joists.angleDeg);
        s = { name: 'pointing-joist', down: e.screen, startOffset: plan.joists.offsetMm, startDot: e.world.x * nx + e.world.y * ny };
        ctx.store.setSession({ selection: { kind: 'joists' } });
        return;
      }
      s = { name: 'panning' };
      panner.start(e.screen);
    },
    pointerMove(ctx, e) {
      if (s.name === 'panning') return panner.move(ctx, e.screen);
      if (s.name === 'pointing-joist') {
        if (Math.hypot(e.screen.x - s.down.x, e.screen.y - s.down.y) < DRAG_THRESHOLD_PX) return;
        ctx.store.beginGesture('move joists');
        s = { name: 'dragging-joist', startOffset: s.startOffset, startDot: s.startDot };
      }
      if (s.name === 'dragging-joist') {
        const { plan } = ctx.store.getState();
        const [nx, ny] = joistNormal(plan.joists.angleDeg);
        let offsetMm = s.startOffset + (e.world.x * nx + e.world.y * ny - s.startDot);
        offsetMm = e.alt ? Math.round(offsetMm) : Math.round(offsetMm / 10) * 10;
        ctx.store.dispatch(cmd('move joists', moveJoistOffset, { offsetMm }), { history: 'gesture' });
      }
    },
    pointerUp(ctx) {
      if (s.name === 'pointing-edge') {
        ctx.store.dispatch(cmd(`joists along edge ${s.edge + 1}`, setJoistsAlongEdge, { edge: s.edge }));
        ctx.store.setSession({ selection: { kind: 'edge', index: s.edge } });
      }
      if (s.name === 'dragging-joist') ctx.store.endGesture();
      panner.end();
      s = { name: 'idle' };
    },
    keyDown(ctx, k) {
      if (k.key === 'Escape' && s.name === 'dragging-joist') {
        ctx.store.cancelGesture();
        s = { name: 'idle' };
        return true;
      }
      return false;
    },
    cancel(ctx) {
      if (s.name === 'dragging-joist') ctx.store.cancelGesture();
      panner.end();
      s = { name: 'idle' };
    },
  };
}
