import { describe, expect, it } from 'vitest';
import { createEditor } from '../../src/editor/create-editor';
import { worldToScreen, world } from '../../src/editor/geometry/coords';
import { distanceToJoistMm } from '../../src/editor/tools/hit-test';
import { emptyPlan, rectPlan } from './fixtures';

// 0.1 px per mm with no pan: screen px = mm / 10, easy to read.
const camera = { zoom: 0.1, panX: 0, panY: 0 };
const at = (x: number, y: number) => worldToScreen(camera, world(x, y));

function click(ed: ReturnType<typeof createEditor>, p: [number, number], mods = {}) {
  ed.pointerDown({ ...at(...p), ...mods });
  ed.pointerUp({ ...at(...p), ...mods });
}

function drag(ed: ReturnType<typeof createEditor>, from: [number, number], to: [number, number], mods = {}) {
  ed.pointerDown({ ...at(...from), ...mods });
  for (let k = 1; k <= 5; k++) {
    ed.pointerMove({ ...at(from[0] + ((to[0] - from[0]) * k) / 5, from[1] + ((to[1] - from[1]) * k) / 5), ...mods });
  }
  ed.pointerUp({ ...at(...to), ...mods });
}

describe('outline tool', () => {
  it('draws a rectangle by clicking corners, snapping to the grid, and closes on the first corner', () => {
    const ed = createEditor(emptyPlan(), { camera });
    for (const p of [
      [10, 20],
      [6020, -30],
      [5990, 4010],
      [0, 3990],
    ] as [number, number][]) {
      ed.pointerDown(at(...p));
      ed.pointerUp(at(...p));
    }
    expect(ed.toolState()).toBe('drawing');
    ed.pointerDown(at(5, 5));
    ed.pointerUp(at(5, 5));
    expect(ed.toolState()).toBe('idle');
    expect(ed.store.getState().plan.outline).toEqual([
      [0, 0],
      [6000, 0],
      [6000, 4000],
      [0, 4000],
    ]);
    // Each corner was its own step.
    ed.keyDown({ key: 'z', ctrl: true });
    expect(ed.store.getState().plan.outline).toHaveLength(3);
  });

  it('Alt draws freely, without snapping', () => {
    const ed = createEditor(emptyPlan(), { camera });
    ed.pointerDown({ ...at(13, 27), alt: true });
    expect(ed.store.getState().plan.outline[0]).toEqual([13, 27]);
  });

  it('drags a corner as one undoable step, and Escape cancels a drag', () => {
    const ed = createEditor(rectPlan(), { camera });
    const before = ed.store.getState().plan;
    drag(ed, [8400, 5200], [9000, 6000]);
    expect(ed.store.getState().plan.outline[2]).toEqual([9000, 6000]);
    expect(ed.store.getState().undoStack).toHaveLength(1);
    ed.keyDown({ key: 'z', ctrl: true });
    expect(ed.store.getState().plan).toBe(before);
    ed.keyDown({ key: 'z', ctrl: true, shift: true });
    expect(ed.store.getState().plan.outline[2]).toEqual([9000, 6000]);

    ed.pointerDown(at(9000, 6000));
    ed.pointerMove(at(9500, 6500));
    ed.keyDown({ key: 'Escape' });
    expect(ed.store.getState().plan.outline[2]).toEqual([9000, 6000]);
  });

  it('inserts a corner by dragging an edge midpoint, and deletes the selected corner', () => {
    const ed = createEditor(rectPlan(), { camera });
    drag(ed, [4200, 0], [4200, -1000]);
    const { plan } = ed.store.getState();
    expect(plan.outline).toEqual([
      [0, 0],
      [4200, -1000],
      [8400, 0],
      [8400, 5200],
      [0, 5200],
    ]);
    expect(ed.store.getState().undoStack).toHaveLength(1);
    ed.keyDown({ key: 'Delete' });
    expect(ed.store.getState().plan.outline).toHaveLength(4);
    ed.keyDown({ key: 'y', ctrl: true }); // nothing to redo: no-op
    ed.keyDown({ key: 'z', ctrl: true });
    ed.keyDown({ key: 'z', ctrl: true });
    expect(ed.store.getState().plan).toEqual(rectPlan());
  });

  it('gives a finger a larger hit target than a mouse', () => {
    const ed = createEditor(rectPlan(), { camera });
    // 15 px from corner 2 (8400, 5200) at 0.1 px/mm.
    const near = { x: 840 + 15, y: 520 };
    ed.pointerDown(near);
    ed.pointerUp(near);
    expect(ed.store.getState().session.selection).not.toEqual({ kind: 'corner', index: 2 });
    ed.pointerDown({ ...near, touch: true });
    ed.pointerUp({ ...near, touch: true });
    expect(ed.store.getState().session.selection).toEqual({ kind: 'corner', index: 2 });
  });

  it('clicking empty paper clears the selection but keeps redo', () => {
    const ed = createEditor(rectPlan(), { camera });
    drag(ed, [8400, 5200], [9000, 6000]);
    ed.undo();
    ed.pointerDown(at(20000, 20000));
    ed.pointerUp(at(20000, 20000));
    expect(ed.store.getState().session.selection).toBeNull();
    expect(ed.store.getState().redoStack).toHaveLength(1);
  });
});

describe('joists tool', () => {
  it('drags a joist to set the first joist position', () => {
    const ed = createEditor(rectPlan(), { camera, step: 'joists' });
    // Joists run at 90° (down the page); the centre line at x = 1200 is a joist.
    drag(ed, [1200, 2600], [1330, 2600]);
    const p = ed.store.getState().plan;
    expect(distanceToJoistMm(p, world(1330, 100))).toBeLessThan(1);
    expect(ed.store.getState().undoStack).toHaveLength(1);
  });

  it('clicking an edge runs the joists along it', () => {
    const ed = createEditor(rectPlan(), { camera, step: 'joists' });
    ed.pointerDown(at(4000, 5200));
    ed.pointerUp(at(4000, 5200));
    expect(ed.store.getState().plan.joists.angleDeg).toBe(0);
  });
});

describe('exclusions tool', () => {
  it('draws a rectangle of the chosen kind by two clicks, moves and resizes it, and deletes it', () => {
    const ed = createEditor(rectPlan(), { camera, step: 'exclusions', exclusionKind: 'hatch' });
    click(ed, [3000, 3000]);
    expect(ed.toolState()).toBe('drawing-rect');
    ed.pointerMove(at(3400, 3500));
    expect(ed.store.getState().session.draft?.points).toEqual([
      [3000, 3000],
      [3400, 3500],
    ]);
    click(ed, [3600, 3900]);
    let ex = ed.store.getState().plan.exclusions;
    expect(ex).toHaveLength(3);
    expect(ex[2]).toEqual({
      kind: 'hatch',
      polygon: [
        [3000, 3000],
        [3600, 3000],
        [3600, 3900],
        [3000, 3900],
      ],
    });
    expect(ed.store.getState().session.selection).toEqual({ kind: 'exclusion', index: 2 });

    drag(ed, [3300, 3400], [4300, 3400]);
    ex = ed.store.getState().plan.exclusions;
    expect(ex[2].polygon![0]).toEqual([4000, 3000]);

    drag(ed, [4600, 3900], [4800, 4200]); // the south-east handle
    expect(ed.store.getState().plan.exclusions[2].polygon![2]).toEqual([4800, 4200]);

    ed.keyDown({ key: 'Delete' });
    expect(ed.store.getState().plan.exclusions).toHaveLength(2);
    for (let i = 0; i < 4; i++) ed.undo();
    expect(ed.store.getState().plan).toEqual(rectPlan());
  });

  it('places a downlight with a click and draws a polygon by clicks', () => {
    const ed = createEditor(rectPlan(), { camera, step: 'exclusions', exclusionKind: 'downlight' });
    ed.pointerDown(at(6000, 1000));
    ed.pointerUp(at(6000, 1000));
    expect(ed.store.getState().plan.exclusions[2]).toEqual({ kind: 'downlight', at: [6000, 1000] });

    ed.store.setSession({ exclusionKind: 'chimney', exclusionShape: 'polygon', selection: null });
    for (const p of [
      [6000, 3000],
      [7000, 3000],
      [6500, 4000],
    ] as [number, number][]) {
      ed.pointerDown(at(...p));
      ed.pointerUp(at(...p));
    }
    ed.keyDown({ key: 'Enter' });
    expect(ed.store.getState().plan.exclusions[3]).toEqual({
      kind: 'chimney',
      polygon: [
        [6000, 3000],
        [7000, 3000],
        [6500, 4000],
      ],
    });
  });
});

describe('eaves tool and global keys', () => {
  it('clicking an edge toggles its eaves mark', () => {
    const ed = createEditor(rectPlan(), { camera, step: 'eaves' });
    ed.pointerDown(at(8400, 2000));
    ed.pointerUp(at(8400, 2000));
    expect(ed.store.getState().plan.eavesEdges).toEqual([0, 1, 2]);
    ed.pointerDown(at(8400, 2000));
    ed.pointerUp(at(8400, 2000));
    expect(ed.store.getState().plan.eavesEdges).toEqual([0, 2]);
  });

  it('number keys change step, f fits the plan, and the wheel zooms about the pointer', () => {
    const ed = createEditor(rectPlan(), { camera, viewport: { width: 1000, height: 700 } });
    ed.keyDown({ key: '3' });
    expect(ed.store.getState().session.step).toBe('exclusions');
    ed.keyDown({ key: 'f' });
    const cam = ed.store.getState().session.camera;
    expect(worldToScreen(cam, world(4200, 2600)).x).toBeCloseTo(500, 6);
    ed.wheel({ x: 100, y: 100, deltaY: -200 });
    expect(ed.store.getState().session.camera.zoom).toBeGreaterThan(cam.zoom);
  });
});

describe('read-only editor', () => {
  it('pans and selects but never changes the plan', () => {
    const ed = createEditor(rectPlan(), { camera }, { readOnly: true });
    const before = ed.store.getState().plan;
    drag(ed, [8400, 5200], [9000, 6000]);
    ed.keyDown({ key: 'Delete' });
    ed.keyDown({ key: 'z', ctrl: true });
    expect(ed.store.getState().plan).toBe(before);
    expect(ed.store.getState().session.camera).not.toEqual(camera); // the drag panned instead
  });
});
