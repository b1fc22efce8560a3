// Selecting walls, inserting corners, typing a wall's length, and panning in the exclusions step,
// driven through the headless editor (pointer down/move/up, keys, undo) and checked on the plan.
import fs from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { planSchema, type Plan } from '../../shared/plan/plan-schema';
import { cmd, setEdgeLength, setEdgeLengthDetailed } from '../../src/editor/commands';
import { createEditor } from '../../src/editor/create-editor';
import { world, worldToScreen } from '../../src/editor/geometry/coords';
import { rectPlan } from './fixtures';

const camera = { zoom: 0.1, panX: 0, panY: 0 };
const at = (x: number, y: number) => worldToScreen(camera, world(x, y));
const example = (f: string): Plan => planSchema.parse(JSON.parse(fs.readFileSync(path.join(__dirname, '..', '..', 'examples', f), 'utf8')));

function drag(ed: ReturnType<typeof createEditor>, from: [number, number], to: [number, number]) {
  ed.pointerDown(at(...from));
  for (let k = 1; k <= 5; k++) ed.pointerMove(at(from[0] + ((to[0] - from[0]) * k) / 5, from[1] + ((to[1] - from[1]) * k) / 5));
  ed.pointerUp(at(...to));
}

const edges = (p: Plan) => p.outline.map((a, i) => [a, p.outline[(i + 1) % p.outline.length]] as const);
const isAxisAligned = (p: Plan) => edges(p).every(([a, b]) => a[0] === b[0] || a[1] === b[1]);
const edgeLength = (p: Plan, i: number) => {
  const [a, b] = edges(p)[i];
  return Math.hypot(b[0] - a[0], b[1] - a[1]);
};

describe('walls in the outline step', () => {
  it('a click on the middle of a wall (its handle) selects the wall and inserts nothing', () => {
    const ed = createEditor(rectPlan(), { camera });
    const before = ed.store.getState().plan;
    ed.pointerDown(at(4200, 0));
    ed.pointerMove(at(4210, 0)); // 1 px of hand tremor is still a click
    ed.pointerUp(at(4210, 0));
    expect(ed.store.getState().plan).toBe(before);
    expect(ed.store.getState().undoStack).toHaveLength(0);
    expect(ed.store.getState().session.selection).toEqual({ kind: 'edge', index: 0 });
    // A click elsewhere on the wall selects it too.
    ed.pointerDown(at(8400, 1000));
    ed.pointerUp(at(8400, 1000));
    expect(ed.store.getState().session.selection).toEqual({ kind: 'edge', index: 1 });
  });

  it('dragging the middle handle inserts a corner as one undo step', () => {
    const ed = createEditor(rectPlan(), { camera });
    drag(ed, [4200, 5200], [4200, 6000]);
    expect(ed.store.getState().plan.outline).toEqual([
      [0, 0],
      [8400, 0],
      [8400, 5200],
      [4200, 6000],
      [0, 5200],
    ]);
    expect(ed.store.getState().session.selection).toEqual({ kind: 'corner', index: 3 });
    ed.undo();
    expect(ed.store.getState().plan).toEqual(rectPlan());
  });

  it('a typed length keeps a rectangle square: the next wall moves with the corner, the opposite wall takes up the change', () => {
    const p = setEdgeLength(rectPlan(), { edge: 0, lengthMm: 9000 });
    expect(p.outline).toEqual([
      [0, 0],
      [9000, 0],
      [9000, 5200],
      [0, 5200],
    ]);
    const q = setEdgeLength(rectPlan(), { edge: 1, lengthMm: 4000 }); // shorter
    expect(q.outline).toEqual([
      [0, 0],
      [8400, 0],
      [8400, 4000],
      [0, 4000],
    ]);
  });

  it('keeps every wall of an L-shaped loft square whichever wall is typed', () => {
    const l = example('l-shape.json');
    expect(isAxisAligned(l)).toBe(true);
    for (let i = 0; i < l.outline.length; i++) {
      const r = setEdgeLengthDetailed(l, { edge: i, lengthMm: edgeLength(l, i) - 300 });
      expect(r.keptSquare).toBe(true);
      expect(isAxisAligned(r.plan)).toBe(true);
      expect(edgeLength(r.plan, i)).toBeCloseTo(edgeLength(l, i) - 300, 6);
    }
  });

  it('refuses a length that would fold the opposite wall back, naming both walls (1-based)', () => {
    expect(() => setEdgeLength(rectPlan(), { edge: 0, lengthMm: 8400 + 8400 })).not.toThrow();
    const l = example('l-shape.json');
    // Find a wall whose absorbing wall is shorter than the change asked for.
    const tries = l.outline.map((_, i) => {
      try {
        setEdgeLength(l, { edge: i, lengthMm: edgeLength(l, i) + 20_000 });
        return null;
      } catch (e) {
        return (e as Error).message;
      }
    });
    const msg = tries.find((m) => m !== null);
    expect(msg).toMatch(/^edge [1-9]\d* at \d+ mm would shrink edge [1-9]\d* /);
  });

  it('on skewed walls with no parallel wall only the end corner moves and the next wall turns', () => {
    const tri = {
      ...rectPlan(),
      eavesEdges: [],
      outline: [
        [0, 0],
        [4000, 0],
        [1000, 3000],
      ] as [number, number][],
    };
    const r = setEdgeLengthDetailed(tri, { edge: 0, lengthMm: 5000 });
    expect(r.keptSquare).toBe(false);
    expect(r.plan.outline).toEqual([
      [0, 0],
      [5000, 0],
      [1000, 3000],
    ]);
  });

  it('the typed length is one undo step through the editor', () => {
    const ed = createEditor(rectPlan(), { camera });
    expect(ed.store.dispatch(cmd('edge 1 length', setEdgeLength, { edge: 0, lengthMm: 9000 }))).toBe(true);
    expect(isAxisAligned(ed.store.getState().plan)).toBe(true);
    ed.undo();
    expect(ed.store.getState().plan).toEqual(rectPlan());
  });
});

describe('paper in the exclusions step', () => {
  it('dragging empty paper pans and draws nothing', () => {
    const ed = createEditor(rectPlan(), { camera, step: 'exclusions', exclusionKind: 'tank' });
    drag(ed, [3000, 3000], [3600, 3900]);
    expect(ed.store.getState().plan).toEqual(rectPlan());
    expect(ed.store.getState().undoStack).toHaveLength(0);
    expect(ed.store.getState().session.camera).toEqual({ zoom: 0.1, panX: 60, panY: 90 });
  });

  it('a drag between the two clicks of a rectangle pans and keeps the first corner', () => {
    const ed = createEditor(rectPlan(), { camera, step: 'exclusions', exclusionKind: 'boarded' });
    ed.pointerDown(at(2000, 2000));
    ed.pointerUp(at(2000, 2000));
    drag(ed, [5000, 4000], [5000, 3000]); // pan up by 100 px
    expect(ed.toolState()).toBe('drawing-rect');
    const cam = ed.store.getState().session.camera;
    const p = worldToScreen(cam, world(3000, 2500));
    ed.pointerDown(p);
    ed.pointerUp(p);
    expect(ed.store.getState().plan.exclusions.at(-1)).toEqual({
      kind: 'boarded',
      polygon: [
        [2000, 2000],
        [3000, 2000],
        [3000, 2500],
        [2000, 2500],
      ],
    });
  });

  it('Escape abandons a rectangle after its first click', () => {
    const ed = createEditor(rectPlan(), { camera, step: 'exclusions' });
    ed.pointerDown(at(2000, 2000));
    ed.pointerUp(at(2000, 2000));
    ed.keyDown({ key: 'Escape' });
    expect(ed.toolState()).toBe('idle');
    expect(ed.store.getState().session.draft).toBeNull();
  });
});
