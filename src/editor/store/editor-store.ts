import type { Plan } from '../../../shared/plan/plan-schema';
import { CommandError, type PlanCommand } from '../commands/command';
import { RunParseError } from '../commands/parse-run';
import { initialSession, type Session } from './session';

/**
 * How a dispatch enters the undo history:
 * - `record`: one undo entry (clears redo);
 * - `gesture`: a preview inside a gesture (a drag); nothing is recorded until `endGesture`,
 *   which squashes the whole gesture into one entry; `cancelGesture` restores the start;
 * - `none`: changes the plan without history (loading a revision); clears both stacks.
 */
export type HistoryMode = 'record' | 'gesture' | 'none';

export type HistoryEntry = { label: string; before: Plan; after: Plan };

export type EditorState = {
  plan: Plan;
  session: Session;
  undoStack: readonly HistoryEntry[];
  redoStack: readonly HistoryEntry[];
  /** Increases on every plan change (including undo/redo); for autosave and dirty checks. */
  planVersion: number;
  /** A gesture (drag) is previewing changes that are not in the history yet. */
  inGesture: boolean;
};

export type EditorStore = ReturnType<typeof createEditorStore>;

const MAX_HISTORY = 300;

export function createEditorStore(plan: Plan, session: Partial<Session> = {}) {
  let state: EditorState = {
    plan,
    session: { ...initialSession(), ...session },
    undoStack: [],
    redoStack: [],
    planVersion: 0,
    inGesture: false,
  };
  let gesture: { before: Plan; label: string } | null = null;
  const listeners = new Set<() => void>();

  function set(next: EditorState) {
    state = next;
    for (const l of listeners) l();
  }

  function setError(message: string | null) {
    if (state.session.error !== message) set({ ...state, session: { ...state.session, error: message } });
  }

  function push(stack: readonly HistoryEntry[], e: HistoryEntry): HistoryEntry[] {
    const s = [...stack, e];
    return s.length > MAX_HISTORY ? s.slice(s.length - MAX_HISTORY) : s;
  }

  /** Applies a command; returns false (and records the message in session.error) if it refused. */
  function dispatch(command: PlanCommand, opts: { history: HistoryMode } = { history: 'record' }): boolean {
    let next: Plan;
    try {
      next = command.apply(state.plan);
    } catch (e) {
      if (e instanceof CommandError || e instanceof RunParseError) {
        setError(e.message);
        return false;
      }
      throw e;
    }
    const session = state.session.error ? { ...state.session, error: null } : state.session;
    if (opts.history === 'gesture') {
      if (!gesture) gesture = { before: state.plan, label: command.label };
      set({ ...state, plan: next, session, planVersion: state.planVersion + 1, inGesture: true });
      return true;
    }
    if (next === state.plan) {
      if (session !== state.session) set({ ...state, session });
      return true;
    }
    if (opts.history === 'none') {
      gesture = null;
      set({ ...state, plan: next, session, undoStack: [], redoStack: [], planVersion: state.planVersion + 1, inGesture: false });
      return true;
    }
    if (gesture) endGesture();
    set({
      ...state,
      plan: next,
      session,
      undoStack: push(state.undoStack, { label: command.label, before: state.plan, after: next }),
      redoStack: [],
      planVersion: state.planVersion + 1,
    });
    return true;
  }

  /** Starts a gesture explicitly (dispatching with `gesture` also starts one). */
  function beginGesture(label: string) {
    if (!gesture) gesture = { before: state.plan, label };
  }

  /** Ends a gesture as one undo entry (none if it changed nothing). */
  function endGesture() {
    const g = gesture;
    gesture = null;
    if (!g || g.before === state.plan) {
      if (state.inGesture) set({ ...state, inGesture: false });
      return;
    }
    set({
      ...state,
      undoStack: push(state.undoStack, { label: g.label, before: g.before, after: state.plan }),
      redoStack: [],
      inGesture: false,
    });
  }

  /** Abandons a gesture, putting the plan back as it was when the gesture began. */
  function cancelGesture() {
    const g = gesture;
    gesture = null;
    if (!g || g.before === state.plan) {
      if (state.inGesture) set({ ...state, inGesture: false });
      return;
    }
    set({ ...state, plan: g.before, planVersion: state.planVersion + 1, inGesture: false });
  }

  function undo(): boolean {
    if (gesture) cancelGesture();
    const e = state.undoStack[state.undoStack.length - 1];
    if (!e) return false;
    set({
      ...state,
      plan: e.before,
      undoStack: state.undoStack.slice(0, -1),
      redoStack: [...state.redoStack, e],
      planVersion: state.planVersion + 1,
      session: { ...state.session, error: null, draft: null },
    });
    return true;
  }

  function redo(): boolean {
    if (gesture) cancelGesture();
    const e = state.redoStack[state.redoStack.length - 1];
    if (!e) return false;
    set({
      ...state,
      plan: e.after,
      undoStack: [...state.undoStack, e],
      redoStack: state.redoStack.slice(0, -1),
      planVersion: state.planVersion + 1,
      session: { ...state.session, error: null, draft: null },
    });
    return true;
  }

  /** Changes session state only: never touches the plan or either history stack. */
  function setSession(patch: Partial<Session> | ((s: Session) => Partial<Session>)) {
    const p = typeof patch === 'function' ? patch(state.session) : patch;
    set({ ...state, session: { ...state.session, ...p } });
  }

  return {
    getState: () => state,
    subscribe(l: () => void) {
      listeners.add(l);
      return () => listeners.delete(l);
    },
    dispatch,
    beginGesture,
    endGesture,
    cancelGesture,
    isInGesture: () => gesture !== null,
    undo,
    redo,
    setSession,
    setError,
  };
}
