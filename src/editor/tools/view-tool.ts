import { pxToMm } from '../geometry/coords';
import { hitEdge, hitExclusion } from './hit-test';
import { createPanner } from './pan';
import { hitPx, type Tool } from './tool';

/** Layers and review steps: click to select (for the panel's details), drag to pan. */
export function createViewTool(): Tool {
  const panner = createPanner();
  return {
    id: 'view',
    state: () => (panner.active() ? 'panning' : 'idle'),
    pointerDown(ctx, e) {
      const { plan } = ctx.store.getState();
      const tol = pxToMm(ctx.camera(), hitPx(e));
      const x = hitExclusion(plan, e.world, tol);
      const edge = x < 0 ? hitEdge(plan, e.world, tol) : null;
      ctx.store.setSession({ selection: x >= 0 ? { kind: 'exclusion', index: x } : edge ? { kind: 'edge', index: edge.edge } : null });
      panner.start(e.screen);
    },
    pointerMove(ctx, e) {
      panner.move(ctx, e.screen);
    },
    pointerUp() {
      panner.end();
    },
    keyDown: () => false,
    cancel() {
      panner.end();
    },
  };
}
