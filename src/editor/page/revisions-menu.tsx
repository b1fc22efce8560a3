import { useState } from 'react';
import { formatDateTime } from '../../components/ui';
import { useRevisions } from '../api/get-revisions';

type Props = { spaceId: string; current: number; canWrite: boolean; onRestore: (revision: number) => void; busy: boolean };

/** The revision list with author and time; restoring saves the old plan as a new revision. */
export function RevisionsMenu({ spaceId, current, canWrite, onRestore, busy }: Props) {
  const [open, setOpen] = useState(false);
  const q = useRevisions(spaceId, open);
  return (
    <div className="relative">
      <button
        type="button"
        className="h-8 rounded border border-graphite/25 bg-white px-2 text-sm"
        onClick={() => setOpen((o) => !o)}
        aria-expanded={open}
        data-testid="revisions-button"
      >
        Revisions
      </button>
      {open && (
        <div
          className="absolute right-0 top-9 z-30 max-h-96 w-80 overflow-y-auto rounded-lg border border-graphite/20 bg-paper p-2 shadow-xl"
          data-testid="revisions-list"
        >
          {q.isLoading && <p className="p-2 text-sm">Loading…</p>}
          {q.isError && <p className="p-2 text-sm text-brick">{(q.error as Error).message}</p>}
          {q.data?.items.length === 0 && <p className="p-2 text-sm text-graphite-light">Not saved yet.</p>}
          <ul>
            {q.data?.items.map((r) => (
              <li key={r.revision} className="flex items-center justify-between gap-2 border-b border-graphite/10 px-1 py-1.5 text-sm last:border-0">
                <div>
                  <div>
                    <span className="font-mono">#{r.revision}</span> {r.author?.name ?? 'unknown'}
                    {r.revision === current && <span className="ml-1 text-xs text-teal-dark">(open)</span>}
                  </div>
                  <div className="text-xs text-graphite-light">
                    {formatDateTime(r.createdAt)}
                    {r.note ? ` · ${r.note}` : ''}
                  </div>
                </div>
                {canWrite && r.revision !== current && (
                  <button
                    type="button"
                    disabled={busy}
                    className="h-7 rounded border border-graphite/25 bg-white px-2 text-xs"
                    onClick={() => {
                      onRestore(r.revision);
                      setOpen(false);
                    }}
                  >
                    Restore
                  </button>
                )}
              </li>
            ))}
          </ul>
        </div>
      )}
    </div>
  );
}
