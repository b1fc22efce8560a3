import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { Plan } from '../../../shared/plan/plan-schema';
import { validatePlan } from '../../../shared/plan/validate-plan';
import { isApiError } from '../../lib/api-client';
import { getPlan } from '../api/get-plan';
import { adoptSavedRevision } from '../api/plan-cache';
import { useRestoreRevision } from '../api/restore-revision';
import { useSavePlan } from '../api/save-plan';
import { cmd, replacePlan } from '../commands';
import type { Editor } from '../create-editor';
import { useEditorState } from '../store/use-editor-state';
import { clearDraft, readDraft, samePlan, writeDraft, type PlanDraft } from './draft-storage';

const AUTOSAVE_AFTER_MS = 5000;

export type SaveStatus = 'saved' | 'unsaved' | 'saving' | 'conflict' | 'error';

/**
 * Saving without loss: explicit save and autosave (5 s after the last change, when the plan is
 * valid), unsaved edits mirrored to localStorage and offered back after a reload, 409 handled by
 * a conflict the estimator resolves (keep mine / load theirs), restore as a new revision.
 */
export function usePlanPersistence(editor: Editor, spaceId: string, initial: { plan: Plan; revision: number; takeoffStored: boolean }, canWrite: boolean) {
  const plan = useEditorState(editor.store, (s) => s.plan);
  const qc = useQueryClient();
  const base = useRef(initial.revision);
  const [revision, setRevision] = useState(initial.revision);
  // A saved plan whose takeoff was never stored (it cannot be worked out on the server yet) can be saved again as it is.
  const [takeoffStored, setTakeoffStored] = useState(initial.revision === 0 || initial.takeoffStored);
  const [savedPlan, setSavedPlan] = useState<Plan>(initial.plan);
  const [conflict, setConflict] = useState<{ theirs: Plan; theirRevision: number; theirSavedAt: string | null } | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [autosave, setAutosave] = useState(true);
  const [recoverable, setRecoverable] = useState<PlanDraft | null>(() => {
    const d = readDraft(spaceId);
    return d && !samePlan(d.plan, initial.plan) ? d : null;
  });
  const save = useSavePlan(spaceId);
  const restore = useRestoreRevision(spaceId);
  const dirty = plan !== savedPlan;

  const adopt = useCallback(
    (p: Plan, rev: number, opts: { intoEditor: boolean }) => {
      base.current = rev;
      setRevision(rev);
      if (opts.intoEditor) editor.store.dispatch(cmd(`revision ${rev}`, replacePlan, { plan: p }));
      setSavedPlan(editor.store.getState().plan);
    },
    [editor],
  );

  // Mirror unsaved edits to the browser; a clean plan needs no draft. A draft offered for
  // recovery is left alone until the estimator decides.
  useEffect(() => {
    if (recoverable) return;
    if (!dirty) return clearDraft(spaceId);
    const t = setTimeout(() => writeDraft(spaceId, { plan, baseRevision: base.current, savedAt: new Date().toISOString() }), 200);
    return () => clearTimeout(t);
  }, [plan, dirty, spaceId, recoverable]);

  const doSave = useCallback(
    async (opts: { baseRevision?: number; auto?: boolean } = {}) => {
      const sent = editor.store.getState().plan;
      setMessage(null);
      try {
        const res = await save.mutateAsync({ plan: sent, baseRevision: opts.baseRevision ?? base.current, note: opts.auto ? 'autosave' : undefined });
        base.current = res.revision;
        setRevision(res.revision);
        setSavedPlan(sent);
        setTakeoffStored(true);
        setConflict(null);
        if (editor.store.getState().plan === sent) clearDraft(spaceId);
      } catch (e) {
        if (isApiError(e) && e.status === 409) {
          const latest = await getPlan(spaceId);
          setConflict({ theirs: latest.plan, theirRevision: latest.revision, theirSavedAt: latest.savedAt });
        } else {
          setMessage(isApiError(e) ? e.message : (e as Error).message);
        }
      }
    },
    [editor, save, spaceId],
  );

  useEffect(() => {
    if (!autosave || !canWrite || !dirty || conflict || recoverable || save.isPending) return;
    if (!validatePlan(plan).ok) return;
    const t = setTimeout(() => void doSave({ auto: true }), AUTOSAVE_AFTER_MS);
    return () => clearTimeout(t);
  }, [autosave, canWrite, dirty, conflict, recoverable, plan, save.isPending, doSave]);

  const status: SaveStatus = conflict ? 'conflict' : save.isPending ? 'saving' : message ? 'error' : dirty ? 'unsaved' : 'saved';

  return {
    status,
    message,
    revision,
    dirty,
    /** Something to save: unsaved edits, or a saved plan without its stored takeoff. */
    canSave: canWrite && (dirty || !takeoffStored),
    autosave,
    setAutosave,
    save: () => doSave(),
    saving: save.isPending || restore.isPending,
    conflict,
    keepMine: () => conflict && doSave({ baseRevision: conflict.theirRevision }),
    loadTheirs: () => {
      if (!conflict) return;
      // Recorded as an edit, so Undo brings the estimator's own version back.
      adopt(conflict.theirs, conflict.theirRevision, { intoEditor: true });
      adoptSavedRevision(qc, spaceId, {
        plan: conflict.theirs,
        revision: conflict.theirRevision,
        createdAt: conflict.theirSavedAt ?? new Date().toISOString(),
      });
      setConflict(null);
    },
    dismissConflict: () => setConflict(null),
    recoverable,
    recoverDraft: () => {
      if (!recoverable) return;
      base.current = recoverable.baseRevision;
      editor.store.dispatch(cmd('recovered draft', replacePlan, { plan: recoverable.plan }));
      setRecoverable(null);
    },
    discardDraft: () => {
      clearDraft(spaceId);
      setRecoverable(null);
    },
    restoreRevision: async (rev: number) => {
      setMessage(null);
      try {
        const res = await restore.mutateAsync({ revision: rev, baseRevision: base.current });
        adopt(res.plan, res.revision, { intoEditor: true });
        setTakeoffStored(true);
      } catch (e) {
        if (isApiError(e) && e.status === 409) {
          const latest = await getPlan(spaceId);
          setConflict({ theirs: latest.plan, theirRevision: latest.revision, theirSavedAt: latest.savedAt });
        } else setMessage((e as Error).message);
      }
    },
  };
}
