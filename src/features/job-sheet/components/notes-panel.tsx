import { useState } from 'react';
import { formatDateTime } from '../../../../shared/dates';
import type { ShownNote } from '../merge-pending';

/** Notes on the job: what was found, what was left, anything the office should know. */
export function NotesPanel({ notes, onAdd }: { notes: ShownNote[]; onAdd?: (text: string) => void }) {
  const [text, setText] = useState('');
  return (
    <div>
      <ul className="mb-3 flex flex-col gap-2" data-testid="notes-list">
        {notes.length === 0 && <li className="text-base text-graphite-light">No notes yet.</li>}
        {notes.map((n) => (
          <li key={n.id} className="rounded-md border-2 border-graphite/20 bg-white p-3 text-lg">
            <p className="whitespace-pre-wrap">{n.text}</p>
            <p className="mt-1 text-sm text-graphite-light">
              {n.byName}, {formatDateTime(n.at)}
              {n.pending && <strong className="text-straw-dark"> · waiting to send</strong>}
            </p>
          </li>
        ))}
      </ul>
      {onAdd && (
        <form
          onSubmit={(e) => {
            e.preventDefault();
            if (!text.trim()) return;
            onAdd(text.trim());
            setText('');
          }}
        >
          <label htmlFor="new-note" className="block text-base font-semibold">
            Add a note
          </label>
          <textarea
            id="new-note"
            value={text}
            onChange={(e) => setText(e.target.value)}
            rows={3}
            maxLength={4000}
            className="mt-1 w-full rounded-md border-2 border-graphite/40 bg-white p-2 text-lg"
          />
          <button
            type="submit"
            disabled={!text.trim()}
            className="mt-2 min-h-12 w-full rounded-md bg-teal-dark px-4 text-lg font-bold text-white disabled:opacity-50"
          >
            Save note
          </button>
        </form>
      )}
    </div>
  );
}
