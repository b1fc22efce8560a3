type Props = {
  theirRevision: number | null;
  busy: boolean;
  onKeepMine: () => void;
  onLoadTheirs: () => void;
  onCancel: () => void;
};

/**
 * Someone saved this plan while it was open here. Neither version is dropped silently: keep mine
 * saves it as the next revision (theirs stays in the history); load theirs replaces the plan here,
 * and mine is still one undo away and in this browser's draft.
 */
export function ConflictDialog({ theirRevision, busy, onKeepMine, onLoadTheirs, onCancel }: Props) {
  return (
    <div
      className="fixed inset-0 z-50 flex items-center justify-center bg-graphite/40"
      role="dialog"
      aria-modal="true"
      aria-labelledby="conflict-title"
      data-testid="conflict-dialog"
    >
      <div className="max-w-md rounded-lg bg-paper p-5 shadow-xl">
        <h2 id="conflict-title" className="text-lg font-semibold">
          Someone else saved this plan
        </h2>
        <p className="mt-2 text-sm">
          Revision {theirRevision ?? '?'} was saved after you opened the plan. Choose which version to carry on with — the other one is kept.
        </p>
        <ul className="mt-2 list-disc pl-5 text-sm text-graphite-light">
          <li>
            <b>Keep mine</b>: your plan becomes the next revision; theirs stays in the revision list.
          </li>
          <li>
            <b>Load theirs</b>: their plan replaces yours here; Undo brings yours back.
          </li>
        </ul>
        <div className="mt-4 flex flex-wrap gap-2">
          <button type="button" disabled={busy} onClick={onKeepMine} className="h-9 rounded bg-teal-dark px-3 text-sm text-white" data-testid="keep-mine">
            Keep mine as a new revision
          </button>
          <button
            type="button"
            disabled={busy}
            onClick={onLoadTheirs}
            className="h-9 rounded border border-graphite/30 bg-white px-3 text-sm"
            data-testid="load-theirs"
          >
            Load theirs
          </button>
          <button type="button" disabled={busy} onClick={onCancel} className="h-9 rounded px-3 text-sm">
            Decide later
          </button>
        </div>
      </div>
    </div>
  );
}
