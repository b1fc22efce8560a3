import { describe, expect, it } from 'vitest';
import { cmd, moveCorner, setEavesGap, toggleEaves } from '../../src/editor/commands';
import { createEditorStore } from '../../src/editor/store/editor-store';
import { rectPlan } from './fixtures';

describe('undo history', () => {
  it('undoes and redoes a series of changes in order', () => {
    const store = createEditorStore(rectPlan());
    const p0 = store.getState().plan;
    store.dispatch(cmd('gap', setEavesGap, { gapMm: 25 }));
    const p1 = store.getState().plan;
    store.dispatch(cmd('eaves', toggleEaves, { edge: 1 }));
    const p2 = store.getState().plan;
    store.undo();
    expect(store.getState().plan).toBe(p1);
    store.undo();
    expect(store.getState().plan).toBe(p0);
    expect(store.undo()).toBe(false);
    store.redo();
    store.redo();
    expect(store.getState().plan).toBe(p2);
    expect(store.redo()).toBe(false);
  });

  it('a selection change does not clear redo; a plan change does', () => {
    const store = createEditorStore(rectPlan());
    store.dispatch(cmd('gap', setEavesGap, { gapMm: 25 }));
    store.undo();
    store.setSession({ selection: { kind: 'corner', index: 2 } });
    expect(store.getState().redoStack).toHaveLength(1);
    store.dispatch(cmd('eaves', toggleEaves, { edge: 1 }));
    expect(store.getState().redoStack).toHaveLength(0);
  });

  it('squashes a gesture into one entry and cancel restores the start', () => {
    const store = createEditorStore(rectPlan());
    const p0 = store.getState().plan;
    for (let y = 5300; y <= 6000; y += 100) {
      store.dispatch(cmd('move', moveCorner, { index: 2, to: [8400, y] }), { history: 'gesture' });
    }
    expect(store.getState().undoStack).toHaveLength(0);
    store.endGesture();
    expect(store.getState().undoStack).toHaveLength(1);
    expect(store.getState().plan.outline[2]).toEqual([8400, 6000]);
    store.undo();
    expect(store.getState().plan).toBe(p0);

    store.dispatch(cmd('move', moveCorner, { index: 2, to: [9000, 9000] }), { history: 'gesture' });
    store.cancelGesture();
    expect(store.getState().plan).toBe(p0);
    expect(store.getState().redoStack).toHaveLength(1); // a cancelled gesture changed nothing
  });

  it('a command that changes nothing records nothing', () => {
    const store = createEditorStore(rectPlan());
    store.dispatch({ label: 'noop', apply: (p) => p });
    expect(store.getState().undoStack).toHaveLength(0);
  });

  it('loading a plan without history clears both stacks', () => {
    const store = createEditorStore(rectPlan());
    store.dispatch(cmd('gap', setEavesGap, { gapMm: 25 }));
    store.dispatch({ label: 'load', apply: () => rectPlan() }, { history: 'none' });
    expect(store.getState().undoStack).toHaveLength(0);
    expect(store.getState().plan.eavesGapMm).toBe(50);
  });
});
