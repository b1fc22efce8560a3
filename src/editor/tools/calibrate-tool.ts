import { createPanner } from './pan';
import type { Tool } from './tool';

/**
 * Background calibration: click two points a known distance apart on the underlay; the UI then
 * asks for the real distance (see calibrateBackground). Escape starts again.
 */
export function createCalibrateTool(): Tool {
  const panner = createPanner();
  let down: { x: number; y: number } | null = null;
  return {
    id: 'calibrate',
    state: () => (panner.active() ? 'panning' : 'idle'),
    pointerDown(ctx, e) {
      down = e.screen;
      panner.start(e.screen);
    },
    pointerMove(ctx, e) {
      panner.move(ctx, e.screen);
    },
    pointerUp(ctx, e) {
      panner.end();
      const wasClick = down && Math.hypot(e.screen.x - down.x, e.screen.y - down.y) < 4;
      down = null;
      if (!wasClick) return;
      const { session } = ctx.store.getState();
      const p: [number, number] = [e.world.x, e.world.y];
      const pts = session.draft?.kind === 'calibrate' ? session.draft.points : [];
      if (pts.length === 0) ctx.store.setSession({ draft: { kind: 'calibrate', points: [p], cursor: p }, calibration: null });
      else ctx.store.setSession({ draft: null, calibration: { a: pts[0], b: p } });
    },
    keyDown(ctx, k) {
      if (k.key !== 'Escape') return false;
      ctx.store.setSession({ draft: null, calibration: null });
      return true;
    },
    cancel(ctx) {
      panner.end();
      ctx.store.setSession({ draft: null });
    },
  };
}
