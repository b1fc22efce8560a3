import { describe, expect, it } from 'vitest';
import {
  addCorner,
  addExclusion,
  calibrateBackground,
  closeOutlineFromRun,
  cmd,
  deleteCorner,
  deleteExclusion,
  insertCorner,
  moveCorner,
  moveExclusion,
  moveJoistOffset,
  replacePlan,
  resizeExclusion,
  setBackground,
  setEavesGap,
  setEdgeLength,
  setExclusionKind,
  setExclusionLabel,
  setExisting,
  setBoards,
  setEavesMode,
  setRoof,
  setSiteNotes,
  setJoists,
  setJoistsAlongEdge,
  setOutline,
  setPlanName,
  setProducts,
  setTarget,
  toggleEaves,
  type PlanCommand,
} from '../../src/editor/commands';
import { createEditorStore } from '../../src/editor/store/editor-store';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { rectPlan } from './fixtures';

const withBg = (p: Plan): Plan => ({ ...p, background: { url: '/x.png', mmPerPx: 10, originMm: [100, 100], opacity: 0.5, locked: false } });

// Every command, with arguments that change the rect plan.
const cases: [string, PlanCommand, (p: Plan) => Plan][] = [
  ['addCorner', cmd('x', addCorner, { at: [4000, 6000] }), (p) => p],
  ['moveCorner', cmd('x', moveCorner, { index: 2, to: [9000, 6000] }), (p) => p],
  ['insertCorner', cmd('x', insertCorner, { edge: 0, at: [4200, 0] }), (p) => p],
  ['deleteCorner', cmd('x', deleteCorner, { index: 1 }), (p) => p],
  ['setEdgeLength', cmd('x', setEdgeLength, { edge: 0, lengthMm: 9000 }), (p) => p],
  ['closeOutlineFromRun', cmd('x', closeOutlineFromRun, { text: '4200 R 3600 D 4200 L' }), (p) => p],
  [
    'setOutline',
    cmd('x', setOutline, {
      outline: [
        [0, 0],
        [1000, 0],
        [0, 1000],
      ],
    }),
    (p) => p,
  ],
  ['setJoists', cmd('x', setJoists, { centresMm: 600 }), (p) => p],
  ['setJoistsAlongEdge', cmd('x', setJoistsAlongEdge, { edge: 0 }), (p) => p],
  ['moveJoistOffset', cmd('x', moveJoistOffset, { offsetMm: 120 }), (p) => p],
  [
    'addExclusion',
    cmd('x', addExclusion, {
      exclusion: {
        kind: 'hatch',
        polygon: [
          [3000, 3000],
          [3600, 3000],
          [3600, 3900],
          [3000, 3900],
        ],
      },
    }),
    (p) => p,
  ],
  ['moveExclusion', cmd('x', moveExclusion, { index: 0, dx: 100, dy: -50 }), (p) => p],
  ['resizeExclusion', cmd('x', resizeExclusion, { index: 0, box: { minX: 400, minY: 400, maxX: 2000, maxY: 1500 } }), (p) => p],
  ['setExclusionLabel', cmd('x', setExclusionLabel, { index: 0, label: 'header tank' }), (p) => p],
  ['setExclusionKind', cmd('x', setExclusionKind, { index: 0, kind: 'boarded' }), (p) => p],
  ['deleteExclusion', cmd('x', deleteExclusion, { index: 1 }), (p) => p],
  ['toggleEaves', cmd('x', toggleEaves, { edge: 1 }), (p) => p],
  ['setEavesGap', cmd('x', setEavesGap, { gapMm: 25 }), (p) => p],
  ['setExisting', cmd('x', setExisting, { depthMm: 50, condition: 'compressed' }), (p) => p],
  [
    'setBoards',
    cmd('x', setBoards, { index: 0, boards: 'raise' }),
    (p) => ({ ...p, exclusions: [{ ...p.exclusions[0], kind: 'boarded' }, ...p.exclusions.slice(1)] }),
  ],
  ['setEavesMode', cmd('x', setEavesMode, { mode: 'ventilators' }), (p) => p],
  ['setRoof', cmd('x', setRoof, { shape: 'hipped', pitchDeg: 40 }), (p) => p],
  ['setSiteNotes', cmd('x', setSiteNotes, { extractFanDucts: 2 }), (p) => p],
  ['setTarget', cmd('x', setTarget, { target: { uValue: 0.16 } }), (p) => p],
  ['setProducts', cmd('x', setProducts, { products: { baseProductId: 'roll-100', crossProductIds: ['roll-170'] } }), (p) => p],
  ['setBackground', cmd('x', setBackground, { background: { opacity: 0.8, locked: true } }), withBg],
  ['calibrateBackground', cmd('x', calibrateBackground, { a: [0, 0], b: [1000, 0], realMm: 2000 }), withBg],
  ['setPlanName', cmd('x', setPlanName, { name: 'Garage loft' }), (p) => p],
  [
    'replacePlan',
    cmd('x', replacePlan, {
      plan: {
        format: 'quiltline-plan/1',
        name: 'Other',
        outline: [
          [0, 0],
          [1, 0],
          [0, 1],
        ],
        joists: { angleDeg: 0, centresMm: 600, widthMm: 47, depthMm: 100 },
      },
    }),
    (p) => p,
  ],
];

describe('plan commands', () => {
  it.each(cases)('%s changes the plan, undoes exactly and redoes to the same plan', (_name, command, prep) => {
    const start = prep(rectPlan());
    const snapshot = structuredClone(start);
    const store = createEditorStore(start);
    expect(store.dispatch(command)).toBe(true);
    const after = structuredClone(store.getState().plan);
    expect(after).not.toEqual(snapshot);
    expect(planSchema.safeParse(after).success).toBe(true);
    expect(start).toEqual(snapshot); // pure: the input plan is not mutated
    store.undo();
    expect(store.getState().plan).toEqual(snapshot);
    store.redo();
    expect(store.getState().plan).toEqual(after);
  });

  it('insertCorner keeps a split eaves edge eaves on both halves and shifts later edges', () => {
    const p = insertCorner(rectPlan(), { edge: 0, at: [4200, 0] });
    expect(p.outline[1]).toEqual([4200, 0]);
    expect(p.eavesEdges).toEqual([0, 1, 3]);
  });

  it('deleteCorner merges the two edges at the corner and renumbers the eaves', () => {
    const p = deleteCorner(rectPlan(), { index: 2 }); // edges 1 and 2 merge into edge 1
    expect(p.outline).toEqual([
      [0, 0],
      [8400, 0],
      [0, 5200],
    ]);
    expect(p.eavesEdges).toEqual([0]);
    const q = deleteCorner(rectPlan(), { index: 0 }); // edges 3 and 0 merge into the new last edge
    expect(q.outline).toEqual([
      [8400, 0],
      [8400, 5200],
      [0, 5200],
    ]);
    expect(q.eavesEdges).toEqual([1]);
  });

  it('setEdgeLength moves the end corner along the edge so the edge has the typed length', () => {
    const p = setEdgeLength(rectPlan(), { edge: 1, lengthMm: 6000 });
    expect(p.outline[2]).toEqual([8400, 6000]);
    expect(() => setEdgeLength(rectPlan(), { edge: 1, lengthMm: -5 })).toThrow(/positive/);
  });

  it('setJoists refuses a joist wider than its centres', () => {
    expect(() => setJoists(rectPlan(), { widthMm: 450 })).toThrow(/^joist width of 450 mm must be less than the joist centres \(400 mm\)/);
    // Centres typed too small is a centres problem, named as such (the rule involves both).
    expect(() => setJoists(rectPlan(), { centresMm: 40 })).toThrow(/^joist centres of 40 mm must be more than the joist width \(47 mm\)/);
  });

  it('setJoistsAlongEdge turns the joists parallel to the edge', () => {
    expect(setJoistsAlongEdge(rectPlan(), { edge: 1 }).joists.angleDeg).toBe(90);
    expect(setJoistsAlongEdge(rectPlan(), { edge: 2 }).joists.angleDeg).toBe(0);
  });

  it('moveJoistOffset keeps the offset within one centres spacing', () => {
    expect(moveJoistOffset(rectPlan(), { offsetMm: 950 }).joists.offsetMm).toBe(150);
    expect(moveJoistOffset(rectPlan(), { offsetMm: -100 }).joists.offsetMm).toBe(300);
  });

  it('resizeExclusion keeps rectangles rectangular', () => {
    const p = resizeExclusion(rectPlan(), { index: 0, box: { minX: 0, minY: 0, maxX: 600, maxY: 300 } });
    expect(p.exclusions[0].polygon).toEqual([
      [0, 0],
      [600, 0],
      [600, 300],
      [0, 300],
    ]);
    expect(() => resizeExclusion(rectPlan(), { index: 1, box: { minX: 0, minY: 0, maxX: 600, maxY: 300 } })).toThrow(/point/);
  });

  it('calibrateBackground scales the underlay about the first point', () => {
    const p = calibrateBackground(withBg(rectPlan()), { a: [100, 100], b: [1100, 100], realMm: 3000 });
    expect(p.background?.mmPerPx).toBe(30);
    expect(p.background?.originMm).toEqual([100, 100]);
  });

  it('refuses bad arguments with a message and leaves the plan alone', () => {
    const store = createEditorStore(rectPlan());
    const before = store.getState().plan;
    expect(store.dispatch(cmd('x', moveCorner, { index: 9, to: [0, 0] }))).toBe(false);
    expect(store.getState().session.error).toBe('there is no corner 10');
    expect(store.getState().plan).toBe(before);
    expect(store.getState().undoStack).toHaveLength(0);
    expect(store.dispatch(cmd('x', addExclusion, { exclusion: { kind: 'tank' } as never }))).toBe(false);
    expect(store.getState().session.error).toMatch(/polygon or a point/);
  });
});

describe('boards, eaves and roof commands', () => {
  it('refuses to raise the boards of anything but a boarded area, and drops the choice when the kind changes', () => {
    const plan = rectPlan();
    expect(() => setBoards(plan, { index: 0, boards: 'raise' })).toThrow(/is a tank, not a boarded area/);
    const boarded = setBoards(
      { ...plan, exclusions: [{ ...plan.exclusions[0], kind: 'boarded' }, ...plan.exclusions.slice(1)] },
      { index: 0, boards: 'raise' },
    );
    expect(boarded.exclusions[0].boards).toBe('raise');
    const tank = setExclusionKind(boarded, { index: 0, kind: 'tank' });
    expect(tank.exclusions[0].boards).toBeUndefined();
    expect(planSchema.safeParse(tank).success).toBe(true);
  });

  it('clears the eaves mode back to the company default, and the roof notes when emptied', () => {
    const vent = setEavesMode(rectPlan(), { mode: 'ventilators' });
    expect(setEavesMode(vent, { mode: undefined })).not.toHaveProperty('eavesMode');
    expect(setRoof(setRoof(rectPlan(), { pitchDeg: 40 }), { pitchDeg: undefined })).not.toHaveProperty('roof');
    expect(() => setRoof(rectPlan(), { pitchDeg: 120 })).toThrow(/roof pitchDeg/);
  });
});
