import { cmd, toggleEaves } from '../commands';
import { pxToMm } from '../geometry/coords';
import { hitEdge } from './hit-test';
import { createPanner } from './pan';
import { hitPx, type Tool } from './tool';

/** Eaves step: click an outline edge to mark or unmark it as eaves. Dragging empty paper pans. */
export function createEavesTool(): Tool {
  let s: { name: 'idle' } | { name: 'pointing-edge'; edge: number } | { name: 'panning' } = { name: 'idle' };
  const panner = createPanner();
  return {
    id: 'eaves',
    state: () => s.name,
    pointerDown(ctx, e) {
      const { plan } = ctx.store.getState();
      const edge = hitEdge(plan, e.world, pxToMm(ctx.camera(), hitPx(e)));
      if (edge) s = { name: 'pointing-edge', edge: edge.edge };
      else {
        s = { name: 'panning' };
        panner.start(e.screen);
      }
    },
    pointerMove(ctx, e) {
      if (s.name === 'panning') panner.move(ctx, e.screen);
    },
    pointerUp(ctx) {
      if (s.name === 'pointing-edge') {
        ctx.store.dispatch(cmd(`eaves on edge ${s.edge + 1}`, toggleEaves, { edge: s.edge }));
        ctx.store.setSession({ selection: { kind: 'edge', index: s.edge } });
      }
      panner.end();
      s = { name: 'idle' };
    },
    keyDown: () => false,
    cancel() {
      panner.end();
      s = { name: 'idle' };
    },
  };
}
