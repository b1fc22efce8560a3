// The canvas's pointer actions by keyboard (WCAG 2.2 SC 2.1.1 Keyboard: all functionality
// operable through a keyboard): selecting, nudging, panning and placing an exclusion.
import { describe, expect, it } from 'vitest';
import { createEditor } from '../../src/editor/create-editor';
import { addExclusionAtViewCentre } from '../../src/editor/keyboard-moves';
import { rectPlan } from './fixtures';

const camera = { zoom: 0.1, panX: 0, panY: 0 };
const press = (ed: ReturnType<typeof createEditor>, key: string, shift = false) => ed.keyDown({ key, shift });

describe('keyboard moves on the plan', () => {
  it('steps through the corners with ] and [ and nudges the selected one 10 mm, or 100 mm with Shift, each an undoable step', () => {
    const ed = createEditor(rectPlan(), { camera, step: 'outline' });
    expect(press(ed, ']')).toBe(true);
    expect(ed.store.getState().session.selection).toEqual({ kind: 'corner', index: 0 });
    press(ed, ']');
    press(ed, ']');
    expect(ed.store.getState().session.selection).toEqual({ kind: 'corner', index: 2 });
    press(ed, '[');
    expect(ed.store.getState().session.selection).toEqual({ kind: 'corner', index: 1 });
    // From the last corner, ] comes round to the first.
    ed.store.setSession({ selection: { kind: 'corner', index: 3 } });
    press(ed, ']');
    expect(ed.store.getState().session.selection).toEqual({ kind: 'corner', index: 0 });

    ed.store.setSession({ selection: { kind: 'corner', index: 1 } }); // (8400, 0)
    press(ed, 'ArrowRight');
    press(ed, 'ArrowDown', true);
    expect(ed.store.getState().plan.outline[1]).toEqual([8410, 100]);
    ed.store.undo();
    expect(ed.store.getState().plan.outline[1]).toEqual([8410, 0]);
  });

  it('moves the selected exclusion with the arrows, and pans the view when nothing is selected', () => {
    const ed = createEditor(rectPlan(), { camera, step: 'exclusions' });
    press(ed, ']');
    expect(ed.store.getState().session.selection).toEqual({ kind: 'exclusion', index: 0 });
    press(ed, 'ArrowLeft', true);
    press(ed, 'ArrowUp');
    expect(ed.store.getState().plan.exclusions[0]).toMatchObject({
      polygon: [
        [400, 490],
        [1600, 490],
        [1600, 1390],
        [400, 1390],
      ],
    });

    ed.store.setSession({ selection: null });
    const moved = ed.store.getState().plan;
    const before = ed.store.getState().session.camera;
    press(ed, 'ArrowRight');
    const after = ed.store.getState().session.camera;
    // The view moves right by a tenth of its 800 px width: the plan slides 80 px left.
    expect(after.panX).toBe(before.panX - 80);
    expect(after.panY).toBe(before.panY);
    expect(ed.store.getState().plan).toBe(moved);
  });

  it('places an exclusion of the chosen kind at the middle of the view and selects it', () => {
    const ed = createEditor(rectPlan(), { camera, step: 'exclusions', exclusionKind: 'hatch' });
    // 800 × 600 px at 0.1 px/mm: the middle is (4000, 3000) mm.
    expect(addExclusionAtViewCentre(ed.store)).toBe(true);
    const { plan, session } = ed.store.getState();
    expect(plan.exclusions).toHaveLength(3);
    expect(plan.exclusions[2]).toMatchObject({
      kind: 'hatch',
      polygon: [
        [3700, 2700],
        [4300, 2700],
        [4300, 3300],
        [3700, 3300],
      ],
    });
    expect(session.selection).toEqual({ kind: 'exclusion', index: 2 });
    ed.store.setSession({ exclusionKind: 'downlight' });
    addExclusionAtViewCentre(ed.store);
    expect(ed.store.getState().plan.exclusions[3]).toEqual({ kind: 'downlight', at: [4000, 3000] });
  });

  it('leaves a read-only plan where it is: the arrows only pan', () => {
    const ed = createEditor(rectPlan(), { camera, step: 'outline', selection: { kind: 'corner', index: 0 } }, { readOnly: true });
    press(ed, 'ArrowRight');
    expect(ed.store.getState().plan).toEqual(rectPlan());
    expect(ed.store.getState().session.camera.panX).toBe(-80);
  });
});
