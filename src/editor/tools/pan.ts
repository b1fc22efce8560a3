import { panBy, type ScreenPt } from '../geometry/coords';
import type { ToolContext } from './tool';

/** Drag-to-pan shared by the tools when a press lands on empty paper. */
export function createPanner() {
  let last: ScreenPt | null = null;
  return {
    active: () => last !== null,
    start(s: ScreenPt) {
      last = s;
    },
    move(ctx: ToolContext, s: ScreenPt) {
      if (!last) return;
      const dx = s.x - last.x,
        dy = s.y - last.y;
      last = s;
      ctx.store.setSession((ss) => ({ camera: panBy(ss.camera, dx, dy) }));
    },
    end() {
      last = null;
    },
  };
}
