import type { Exclusion } from '../../shared/plan/plan-schema';
import { addExclusion, cmd, moveCorner, moveExclusion } from './commands';
import { screen, screenToWorld } from './geometry/coords';
import type { EditorStore } from './store/editor-store';
import type { ToolKey } from './tools/tool';

const ARROWS: Record<string, [number, number]> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] };

/** A nudge: 10 mm, or 100 mm with Shift (the plan's grid step). */
const NUDGE_MM = 10;
/** Panning by keyboard moves the view a tenth of its width. */
const PAN_SHARE = 0.1;

/**
 * The canvas's pointer actions by keyboard (WCAG 2.1.1): `[` and `]` step the selection through
 * the corners (outline step) or the exclusions (exclusions step); arrows nudge the selected
 * corner or exclusion, or pan the view when nothing is selected. Each nudge is one undoable command.
 * Returns whether the key was used.
 */
export function keyboardMove(store: EditorStore, key: ToolKey, readOnly: boolean): boolean {
  const { plan, session } = store.getState();
  if (key.key === '[' || key.key === ']') {
    const kind = session.step === 'exclusions' ? 'exclusion' : session.step === 'outline' ? 'corner' : null;
    const count = kind === 'exclusion' ? plan.exclusions.length : kind === 'corner' ? plan.outline.length : 0;
    if (!kind || count === 0) return false;
    const current = session.selection?.kind === kind ? session.selection.index : key.key === ']' ? -1 : count;
    const index = (current + (key.key === ']' ? 1 : -1) + count) % count;
    store.setSession({ selection: { kind, index } });
    return true;
  }
  const dir = ARROWS[key.key];
  if (!dir || key.ctrl || key.alt) return false;
  const step = key.shift ? NUDGE_MM * 10 : NUDGE_MM;
  const [dx, dy] = [dir[0] * step, dir[1] * step];
  const sel = session.selection;
  if (!readOnly && sel?.kind === 'corner' && session.step === 'outline' && plan.outline[sel.index]) {
    const [x, y] = plan.outline[sel.index];
    return store.dispatch(cmd(`move corner ${sel.index + 1}`, moveCorner, { index: sel.index, to: [x + dx, y + dy] }));
  }
  if (!readOnly && sel?.kind === 'exclusion' && session.step === 'exclusions' && plan.exclusions[sel.index]) {
    return store.dispatch(cmd('move exclusion', moveExclusion, { index: sel.index, dx, dy }));
  }
  const { camera, viewport } = session;
  const px = viewport.width * PAN_SHARE;
  // The view moves the way the arrow points: the plan slides the other way.
  store.setSession({ camera: { ...camera, panX: camera.panX - dir[0] * px, panY: camera.panY - dir[1] * px } });
  return true;
}

/** A box placed from the keyboard starts at this size (mm); the panel's fields and the arrows then fit it. */
const KEYBOARD_BOX_MM = 600;

/**
 * Adds an exclusion of the chosen kind at the middle of the view and selects it: the keyboard's
 * way to place what a pointer draws by clicks (a downlight as a point, anything else as a box).
 */
export function addExclusionAtViewCentre(store: EditorStore): boolean {
  const { session } = store.getState();
  const c = screenToWorld(session.camera, screen(session.viewport.width / 2, session.viewport.height / 2));
  const [x, y] = [Math.round(c.x / NUDGE_MM) * NUDGE_MM, Math.round(c.y / NUDGE_MM) * NUDGE_MM];
  const h = KEYBOARD_BOX_MM / 2;
  const exclusion: Exclusion =
    session.exclusionKind === 'downlight'
      ? { kind: 'downlight', at: [x, y] }
      : {
          kind: session.exclusionKind,
          polygon: [
            [x - h, y - h],
            [x + h, y - h],
            [x + h, y + h],
            [x - h, y + h],
          ],
        };
  if (!store.dispatch(cmd(`add ${exclusion.kind}`, addExclusion, { exclusion }))) return false;
  store.setSession({ selection: { kind: 'exclusion', index: store.getState().plan.exclusions.length - 1 } });
  return true;
}
