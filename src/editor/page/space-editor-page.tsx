import { useRef, useState } from 'react';
import { Link, useParams } from 'react-router-dom';
import { ErrorState, LoadingState, formatDateTime } from '../../components/ui';
import { usePlan, type PlanResponse } from '../api/get-plan';
import { uploadBackground } from '../api/upload-background';
import { cmd, replacePlan } from '../commands';
import { createEditor } from '../create-editor';
import { EditorView } from '../ui/editor-view';
import { useCurrentUser } from '../../features/auth/use-current-user';
import { useEditorState } from '../store/use-editor-state';
import { ConflictDialog } from './conflict-dialog';
import { exportPlanFile, readPlanFile } from './plan-file';
import { RevisionsMenu } from './revisions-menu';
import { usePlanPersistence, type SaveStatus } from './use-plan-persistence';

const STATUS_TEXT: Record<SaveStatus, string> = {
  saved: 'Saved',
  unsaved: 'Unsaved changes',
  saving: 'Saving…',
  conflict: 'Saved elsewhere',
  error: 'Not saved',
};

/** /spaces/:id/edit — the plan editor for one loft space, loaded and saved through the API. */
export default function SpaceEditorPage() {
  const { id = '' } = useParams();
  const q = usePlan(id);
  if (q.isLoading) return <LoadingState />;
  if (q.isError || !q.data) return <ErrorState title="Could not open the plan" error={q.error} onRetry={() => void q.refetch()} />;
  return <LoadedEditor key={id} spaceId={id} data={q.data} />;
}

function LoadedEditor({ spaceId, data }: { spaceId: string; data: PlanResponse }) {
  const [editor] = useState(() => createEditor(data.plan, data.canWrite ? {} : { step: 'review' }, { readOnly: !data.canWrite }));
  const p = usePlanPersistence(editor, spaceId, { plan: data.plan, revision: data.revision, takeoffStored: data.takeoffStored }, data.canWrite);
  const importInput = useRef<HTMLInputElement>(null);
  const me = useCurrentUser();
  const livePlan = useEditorState(editor.store, (s) => s.plan);

  const btn = 'h-8 shrink-0 rounded border border-graphite/25 bg-white px-2 text-sm';
  const toolbar = (
    <>
      <input
        ref={importInput}
        type="file"
        accept="application/json,.json"
        className="hidden"
        data-testid="import-file"
        onChange={async (e) => {
          const f = e.target.files?.[0];
          e.target.value = '';
          if (!f) return;
          try {
            const json = await readPlanFile(f);
            if (editor.store.dispatch(cmd(`import ${f.name}`, replacePlan, { plan: json as never }))) editor.fit();
          } catch (err) {
            editor.store.setError((err as Error).message);
          }
        }}
      />
      {data.canWrite && (
        <button type="button" className={btn} onClick={() => importInput.current?.click()}>
          Import
        </button>
      )}
      <button type="button" className={btn} onClick={() => exportPlanFile(editor.store.getState().plan)} data-testid="export">
        Export
      </button>
      <RevisionsMenu spaceId={spaceId} current={p.revision} canWrite={data.canWrite} busy={p.saving} onRestore={(r) => void p.restoreRevision(r)} />
      {data.canWrite ? (
        <>
          <label className="flex shrink-0 items-center gap-1 text-sm">
            <input type="checkbox" checked={p.autosave} onChange={(e) => p.setAutosave(e.target.checked)} /> Autosave
          </label>
          <span
            // A fixed width: a longer status must never push the row, and the canvas, around.
            className={`w-32 shrink-0 truncate text-right text-sm ${p.status === 'saved' ? 'text-teal-dark' : p.status === 'error' || p.status === 'conflict' ? 'text-brick' : 'text-graphite-light'}`}
            data-testid="save-status"
            title={p.message ?? STATUS_TEXT[p.status]}
          >
            {STATUS_TEXT[p.status]}
            {p.revision > 0 && p.status === 'saved' ? ` · rev ${p.revision}` : ''}
          </span>
          <button
            type="button"
            className="h-8 shrink-0 rounded bg-teal-dark px-3 text-sm text-white disabled:opacity-50"
            disabled={p.saving || !p.canSave}
            onClick={() => void p.save()}
            data-testid="save"
          >
            Save
          </button>
        </>
      ) : (
        <span className="rounded bg-paper-dark px-2 py-1 text-xs">Read only</span>
      )}
    </>
  );

  const banner = (
    <>
      {p.recoverable && (
        <div role="status" className="flex flex-wrap items-center gap-3 rounded bg-straw-light px-3 py-2 text-sm shadow" data-testid="draft-banner">
          <span>
            Unsaved changes from {formatDateTime(p.recoverable.savedAt)} were kept in this browser.
            {p.autosavePaused === 'draft' && <b data-testid="autosave-paused"> Autosave is paused until you restore or discard them.</b>}
          </span>
          <button type="button" className="h-8 rounded bg-graphite px-3 text-paper" onClick={p.recoverDraft} data-testid="recover-draft">
            Restore them
          </button>
          <button type="button" className="h-8 rounded px-3 underline" onClick={p.discardDraft}>
            Discard
          </button>
        </div>
      )}
      {p.message && (
        <div role="alert" className="rounded bg-brick-light px-3 py-1.5 text-sm text-brick-dark shadow" data-testid="save-error">
          {p.message}
        </div>
      )}
    </>
  );
  const crumb = (
    <>
      <Link to={`/jobs/${data.space.jobId}`} className="underline">
        Job {data.space.jobReference}
      </Link>
      <span> › </span>
      <span>{data.space.name}</span>
    </>
  );

  return (
    // The whole window below the app's header (3.5 rem and its 1 px border).
    <div className="flex h-[calc(100dvh-3.5rem-1px)] min-h-[480px] flex-col max-sm:h-auto">
      <div className="min-h-0 flex-1">
        <EditorView
          editor={editor}
          products={data.takeoffInputs.products}
          settings={data.takeoffInputs.settings}
          storedTakeoff={data.canWrite ? undefined : data.takeoff}
          toolbar={toolbar}
          crumb={crumb}
          banner={banner}
          onUploadBackground={data.canWrite ? (f) => uploadBackground(spaceId, f) : undefined}
        />
      </div>
      {p.conflict && (
        <ConflictDialog
          conflict={p.conflict}
          mine={livePlan}
          meId={me.id}
          busy={p.saving}
          onKeepMine={() => void p.keepMine()}
          onLoadTheirs={p.loadTheirs}
          onCancel={p.dismissConflict}
        />
      )}
    </div>
  );
}
