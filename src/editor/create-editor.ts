import type { Plan } from '../../shared/plan/plan-schema';
import { fitCamera, screen, screenToWorld, zoomAt, type ScreenPt } from './geometry/coords';
import { createEditorStore } from './store/editor-store';
import { STEPS, type Session, type StepId } from './store/session';
import { createCalibrateTool } from './tools/calibrate-tool';
import { createEavesTool } from './tools/eaves-tool';
import { createExclusionsTool } from './tools/exclusions-tool';
import { createJoistsTool } from './tools/joists-tool';
import { createOutlineTool } from './tools/outline-tool';
import type { Tool, ToolContext, ToolKey } from './tools/tool';
import { createViewTool } from './tools/view-tool';
import { keyboardMove } from './keyboard-moves';

export type PointerInput = { x: number; y: number; shift?: boolean; alt?: boolean; ctrl?: boolean; button?: number; touch?: boolean };
export type KeyInput = { key: string; shift?: boolean; ctrl?: boolean; alt?: boolean };

export type Editor = ReturnType<typeof createEditor>;

/**
 * What a blank plan opens on: a 12 × 9 m sheet from the origin, about a large house's loft
 * (common practice: most UK semis are 8–10 m by 6–8 m), so the first corners are placed at a zoom
 * where the 100 mm grid snapping is usable and the whole loft will fit without zooming out.
 */
export const BLANK_SHEET_MM: [number, number][] = [
  [0, 0],
  [12000, 9000],
];

/**
 * The editor without any view: a store plus the tools, driven by pointer and key events in
 * screen pixels. The canvas forwards its events here; the tests drive it directly.
 */
export function createEditor(plan: Plan, session: Partial<Session> = {}, opts: { readOnly?: boolean } = {}) {
  const store = createEditorStore(plan, session);
  const tools: Record<StepId | 'calibrate', Tool> = {
    outline: createOutlineTool(),
    joists: createJoistsTool(),
    exclusions: createExclusionsTool(),
    eaves: createEavesTool(),
    layers: createViewTool(),
    review: createViewTool(),
    calibrate: createCalibrateTool(),
  };
  let calibrating = false;
  let sized = false;
  // The pointer's plan position for the read-out: hover state outside the store, so moving the
  // mouse over the plan re-renders only the read-out, not the canvas.
  let cursor: [number, number] | null = null;
  const cursorListeners = new Set<() => void>();
  const setCursor = (c: [number, number] | null) => {
    if (c === cursor || (c && cursor && c[0] === cursor[0] && c[1] === cursor[1])) return;
    cursor = c;
    for (const l of cursorListeners) l();
  };
  const ctx: ToolContext = { store, camera: () => store.getState().session.camera };
  // Read only (installers): every step only selects and pans.
  const tool = () => (opts.readOnly ? tools.review : calibrating ? tools.calibrate : tools[store.getState().session.step]);

  const toPointer = (p: PointerInput) => {
    const s = screen(p.x, p.y);
    return {
      screen: s,
      world: screenToWorld(ctx.camera(), s),
      shift: !!p.shift,
      alt: !!p.alt,
      ctrl: !!p.ctrl,
      button: p.button ?? 0,
      touch: !!p.touch,
    };
  };

  function setStep(step: StepId) {
    tool().cancel(ctx);
    calibrating = false;
    store.setSession({ step, selection: null, draft: null, calibration: null });
  }

  /** Shows the whole outline; with none yet, a blank sheet of BLANK_SHEET_MM so a loft fits. */
  function fit() {
    const { plan: p, session: s } = store.getState();
    const pts = p.outline.length > 0 ? p.outline : BLANK_SHEET_MM;
    store.setSession({ camera: fitCamera(pts, s.viewport.width, s.viewport.height) });
  }

  function zoomBy(factor: number, anchor?: ScreenPt) {
    const s = store.getState().session;
    const a = anchor ?? screen(s.viewport.width / 2, s.viewport.height / 2);
    store.setSession({ camera: zoomAt(s.camera, a, factor) });
  }

  /** Global shortcuts first (undo, redo, steps, zoom), then the active tool's. */
  function keyDown(k: KeyInput): boolean {
    const key: ToolKey = { key: k.key, shift: !!k.shift, ctrl: !!k.ctrl, alt: !!k.alt };
    const lower = k.key.toLowerCase();
    if (opts.readOnly && key.ctrl) return false;
    if (key.ctrl && lower === 'z') {
      if (key.shift) store.redo();
      else store.undo();
      return true;
    }
    if (key.ctrl && lower === 'y') {
      store.redo();
      return true;
    }
    if (key.ctrl) return false;
    if (tool().keyDown(ctx, key)) return true;
    if (keyboardMove(store, key, !!opts.readOnly)) return true;
    if (/^[1-6]$/.test(k.key)) {
      setStep(STEPS[Number(k.key) - 1]);
      return true;
    }
    if (lower === 'f') {
      fit();
      return true;
    }
    if (k.key === '+' || k.key === '=') {
      zoomBy(1.25);
      return true;
    }
    if (k.key === '-') {
      zoomBy(0.8);
      return true;
    }
    if (k.key === '?') {
      store.setSession((s) => ({ helpOpen: !s.helpOpen }));
      return true;
    }
    if (k.key === 'Escape' && store.getState().session.helpOpen) {
      store.setSession({ helpOpen: false });
      return true;
    }
    return false;
  }

  return {
    store,
    pointerDown: (p: PointerInput) => tool().pointerDown(ctx, toPointer(p)),
    pointerMove: (p: PointerInput) => {
      const e = toPointer(p);
      setCursor([Math.round(e.world.x), Math.round(e.world.y)]);
      tool().pointerMove(ctx, e);
    },
    /** The pointer left the canvas: the read-out goes blank. */
    pointerLeave: () => setCursor(null),
    /** Where the pointer is on the plan (mm), for the read-out; null off the canvas. */
    cursor: () => cursor,
    subscribeCursor(l: () => void) {
      cursorListeners.add(l);
      return () => cursorListeners.delete(l);
    },
    pointerUp: (p: PointerInput) => tool().pointerUp(ctx, toPointer(p)),
    /** Ends whatever the active tool was doing (pointer lost, window blurred). */
    pointerCancel: () => tool().cancel(ctx),
    keyDown,
    setStep,
    setCalibrating(on: boolean) {
      tool().cancel(ctx);
      calibrating = on;
      store.setSession({ draft: null, calibration: null });
    },
    isCalibrating: () => calibrating,
    readOnly: !!opts.readOnly,
    toolState: () => tool().state(),
    /** Wheel: zoom about the pointer (trackpad pinch arrives as wheel + ctrl in browsers). */
    wheel(p: { x: number; y: number; deltaY: number }) {
      zoomBy(Math.exp(-p.deltaY * 0.0015), screen(p.x, p.y));
    },
    zoomBy,
    fit,
    /** The canvas size in px; the first real size also fits the plan into view. */
    setViewport(width: number, height: number) {
      store.setSession({ viewport: { width, height } });
      if (!sized && width > 0 && height > 0) {
        sized = true;
        fit();
      }
    },
    undo: store.undo,
    redo: store.redo,
  };
}
