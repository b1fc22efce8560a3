import { useQueryClient } from '@tanstack/react-query';
import { useCallback, useEffect, useRef, useState } from 'react';
import type { Plan } from '../../../shared/plan/plan-schema';
import { validatePlan } from '../../../shared/plan/validate-plan';
import { isApiError } from '../../lib/api-client';
import type { RevisionSummary } from '../../../shared/api/spaces';
import { getPlan } from '../api/get-plan';
import { adoptSavedRevision } from '../api/plan-cache';
import { getRevisions } from '../api/get-revisions';
import { useRestoreRevision } from '../api/restore-revision';
import { useSavePlan } from '../api/save-plan';
import { cmd, replacePlan } from '../commands';
import type { Editor } from '../create-editor';
import { useEditorState } from '../store/use-editor-state';
import { clearDraft, readDraft, samePlan, writeDraft, type PlanDraft } from './draft-storage';

const AUTOSAVE_AFTER_MS = 5000;

export type SaveStatus = 'saved' | 'unsaved' | 'saving' | 'conflict' | 'error';

/** The revision saved meanwhile, with who saved it and when (when the history says). */
export type PlanConflict = { theirs: Plan; theirRevision: number; author: RevisionSummary['author']; savedAt: string | null };

/** The latest plan and who saved it, for the conflict dialog. */
async function loadConflict(spaceId: string): Promise<PlanConflict> {
  const latest = await getPlan(spaceId);
  const history = await getRevisions(spaceId).catch(() => null);
  const rev = history?.items.find((r) => r.revision === latest.revision);
  return { theirs: latest.plan, theirRevision: latest.revision, author: rev?.author ?? null, savedAt: rev?.createdAt ?? latest.savedAt };
}

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
  const [conflict, setConflict] = useState<PlanConflict | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  // The plan a save was refused for: once the estimator changes it, the refusal is old news.
  const refusedPlan = useRef<Plan | null>(null);
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
          setConflict(await loadConflict(spaceId));
        } else {
          refusedPlan.current = sent;
          setMessage(isApiError(e) ? e.message : (e as Error).message);
        }
      }
    },
    [editor, save, spaceId],
  );

  // A refused save's bar goes once the plan changes (the fix); the status is then "unsaved" and
  // the next save, by hand or autosave, tells again if it is still refused.
  useEffect(() => {
    if (message && refusedPlan.current && plan !== refusedPlan.current) {
      refusedPlan.current = null;
      setMessage(null);
    }
  }, [plan, message]);

  // Leaving with unsaved changes asks first (the browser shows its own wording; the draft in
  // localStorage is the second line of defence).
  const unsaved = canWrite && (dirty || save.isPending);
  useEffect(() => {
    if (!unsaved) return;
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      e.preventDefault();
      e.returnValue = ''; // older Chromium needs it set
    };
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => window.removeEventListener('beforeunload', onBeforeUnload);
  }, [unsaved]);

  // Autosave waits while a recovered draft is on offer (saving now would bury it under a new
  // revision before the estimator chose); the banner says so, and `autosavePaused` tells the page.
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
    /** Why autosave is not running although it is switched on, if it is not. */
    autosavePaused: autosave && canWrite ? (recoverable ? 'draft' : conflict ? 'conflict' : null) : null,
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
        createdAt: conflict.savedAt ?? new Date().toISOString(),
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
        if (isApiError(e) && e.status === 409) setConflict(await loadConflict(spaceId));
        else setMessage((e as Error).message);
      }
    },
  };
}
