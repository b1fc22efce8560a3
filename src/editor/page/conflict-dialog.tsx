import { formatDateTime } from '../../components/ui';
import type { Plan } from '../../../shared/plan/plan-schema';
import { describePlanDifferences } from './plan-diff';
import type { PlanConflict } from './use-plan-persistence';

type Props = {
  conflict: PlanConflict;
  mine: Plan;
  /** The signed-in user, to tell "you, in another tab" from someone else. */
  meId: string;
  busy: boolean;
  onKeepMine: () => void;
  onLoadTheirs: () => void;
  onCancel: () => void;
};

/**
 * The plan was saved elsewhere while it was open here: by someone else, or by the same person in
 * another tab or device, and the dialog says which, when, and what differs. Neither version is
 * dropped silently: keep mine saves it as the next revision (theirs stays in the history); load
 * theirs replaces the plan here, and mine is still one undo away and in this browser's draft.
 */
export function ConflictDialog({ conflict, mine, meId, busy, onKeepMine, onLoadTheirs, onCancel }: Props) {
  const self = conflict.author?.id === meId;
  const who = self
    ? 'You saved this plan in another tab or window'
    : conflict.author
      ? `${conflict.author.name} saved this plan`
      : 'Someone else saved this plan';
  const other = self ? 'the other tab’s' : 'theirs';
  const diffs = describePlanDifferences(mine, conflict.theirs);
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
          {who}
        </h2>
        <p className="mt-2 text-sm" data-testid="conflict-when">
          Revision {conflict.theirRevision} was saved {conflict.savedAt ? `at ${formatDateTime(conflict.savedAt)}` : ''} after this tab opened the plan. Choose
          which version to carry on with — the other one is kept.
        </p>
        <div className="mt-2 text-sm" data-testid="conflict-differences">
          {diffs.length ? (
            <>
              <p className="font-medium">What differs (yours here, {other} saved):</p>
              <ul className="list-disc pl-5">
                {diffs.map((d) => (
                  <li key={d}>{d}</li>
                ))}
              </ul>
            </>
          ) : (
            <p>The two versions are the same plan.</p>
          )}
        </div>
        <ul className="mt-2 list-disc pl-5 text-sm text-graphite-light">
          <li>
            <b>Keep mine</b>: this tab’s plan becomes the next revision; {other} stays in the revision list.
          </li>
          <li>
            <b>Load {self ? 'the other tab’s' : 'theirs'}</b>: it replaces the plan here; Undo brings this tab’s back.
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
            {self ? 'Load the other tab’s' : 'Load theirs'}
          </button>
          <button type="button" disabled={busy} onClick={onCancel} className="h-9 rounded px-3 text-sm">
            Decide later
          </button>
        </div>
      </div>
    </div>
  );
}
