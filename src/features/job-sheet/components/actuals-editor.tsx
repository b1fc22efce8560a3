import { useState } from 'react';
import type { Actuals } from '../../../../shared/api/actuals';
import type { VanLoad } from '../../../../shared/api/job-sheet';
import type { ActualsPart } from '../../../../shared/api/settings';
import { isApiError } from '../../../lib/api-client';
import { useEditActuals } from '../api/edit-actuals';
import { ActualsForm, actualsFromDraft, missingParts, PART_TEXT, type ActualsDraft } from './actuals-form';

/** The stored figures as the form's text; a product, person or extra the form lists but nothing was stored for is blank. */
export function draftFromActuals(load: VanLoad, people: { id: string }[], stored: Actuals): ActualsDraft {
  const text = (n: number | undefined) => (n === undefined ? '' : String(n));
  const rolls = Object.fromEntries(load.rolls.map((r) => [r.productId, { used: '', returned: '' }]));
  for (const r of stored.rolls) rolls[r.productId] = { used: text(r.used), returned: text(r.returned) };
  const hours = Object.fromEntries(people.map((p) => [p.id, '']));
  for (const h of stored.hours) hours[h.userId] = text(h.hours);
  const extras = Object.fromEntries(load.extras.map((x) => [x.code, '']));
  for (const x of stored.extras) extras[x.code] = text(x.used);
  return { rolls, hours, extras };
}

const list = (a: Actuals, load: VanLoad) =>
  [
    ...a.rolls.map((r) => `${load.rolls.find((x) => x.productId === r.productId)?.productName ?? 'A product'}: ${r.used} used, ${r.returned} back`),
    a.hours.length ? `${a.hours.reduce((n, h) => n + h.hours, 0)} hours on site` : '',
    ...a.extras.map((x) => `${load.extras.find((e) => e.code === x.code)?.label ?? x.code}: ${x.used}`),
  ].filter(Boolean);

/**
 * What was used on a finished job, and, for someone who may (`editable`), a form to correct it.
 * The save names the version shown; if someone saved a correction meanwhile the server refuses
 * it, the figures are fetched again and the person makes the change again on the new ones.
 * Text takes the size of where it is shown (large on the job sheet, small on the office card).
 */
export function ActualsEditor({
  jobId,
  load,
  people,
  stored,
  editable,
  required = [],
  countLabel,
  onSaved,
}: {
  jobId: string;
  load: VanLoad;
  people: { id: string; name: string }[];
  stored: Actuals & { version: number };
  editable: boolean;
  required?: readonly ActualsPart[];
  countLabel?: string;
  onSaved: () => unknown;
}) {
  const [draft, setDraft] = useState<ActualsDraft | null>(null);
  const [notice, setNotice] = useState<string | null>(null);
  const save = useEditActuals(jobId, onSaved);
  const shown = list(stored, load);
  const missing = draft ? missingParts(required, draft) : [];
  const submit = () =>
    save.mutate(
      { actuals: actualsFromDraft(draft!) as Actuals, expectedVersion: stored.version },
      {
        onSuccess: () => {
          setDraft(null);
          setNotice('Saved.');
        },
        onError: (e) => {
          // Someone else's correction won: show theirs and let this person redo theirs on it.
          if (isApiError(e) && e.code === 'actuals_changed') setDraft(null);
          setNotice(isApiError(e) ? e.message : 'Could not save the correction.');
        },
      },
    );
  if (!draft)
    return (
      <div>
        {shown.length ? (
          <ul className="mb-2 list-disc pl-5" data-testid="actuals-recorded">
            {shown.map((s) => (
              <li key={s}>{s}</li>
            ))}
          </ul>
        ) : (
          <p className="mb-2">Nothing was recorded as used.</p>
        )}
        {notice && (
          <p role="status" className="mb-2 font-semibold">
            {notice}
          </p>
        )}
        {editable && (
          <button
            type="button"
            className="min-h-11 rounded-md border-2 border-graphite/40 bg-white px-3 text-base font-semibold"
            onClick={() => {
              setNotice(null);
              setDraft(draftFromActuals(load, people, stored));
            }}
          >
            Correct what was used
          </button>
        )}
      </div>
    );
  return (
    <div>
      <ActualsForm
        load={load}
        people={people}
        draft={draft}
        onChange={setDraft}
        required={required}
        countLabel={countLabel}
        hint="Change what was different from what is recorded."
      />
      {missing.length > 0 && (
        <p className="mb-2 font-semibold text-brick-dark">Fill in {missing.map((p) => PART_TEXT[p]).join(' and ')}: the company asks for them.</p>
      )}
      <div className="flex gap-2">
        <button
          type="button"
          disabled={save.isPending || missing.length > 0}
          onClick={submit}
          className="min-h-11 rounded-md bg-teal-dark px-4 text-base font-bold text-white disabled:bg-graphite/30"
        >
          {save.isPending ? 'Saving…' : 'Save correction'}
        </button>
        <button type="button" onClick={() => setDraft(null)} className="min-h-11 rounded-md border-2 border-graphite/40 bg-white px-3 text-base font-semibold">
          Cancel
        </button>
      </div>
    </div>
  );
}
