import { useState } from 'react';
import type { JobSheet } from '../../../../shared/api/job-sheet';
import { isApiError } from '../../../lib/api-client';
import { formatDate } from '../../../components/ui/format';
import { useFinishJob } from '../api/finish-job';
import { newKey } from '../offline/outbox-db';
import { ActualsForm, actualsFromDraft, askedParts, draftFromVanLoad, missingParts, PART_TEXT } from './actuals-form';
import { finishBlockers, type PendingPhoto, type ShownTick } from '../merge-pending';
import { SheetSection } from './sheet-section';

/** Today's date where the installer is, as YYYY-MM-DD (the install date is a local calendar date). */
function localToday(now = new Date()): string {
  const p = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${p(now.getMonth() + 1)}-${p(now.getDate())}`;
}

/**
 * Mark installed: only with every check ticked or explained and an after photo of every space, and online.
 * A job booked for a later day asks once more first: marking next week's job installed today is
 * usually a tap on the wrong job.
 */
export function FinishPanel({
  sheet,
  ticks,
  pendingPhotos,
  waiting,
  people,
  finishQueued = false,
}: {
  sheet: JobSheet;
  ticks: Map<string, ShownTick>;
  pendingPhotos: PendingPhoto[];
  waiting: number;
  /** Who may have worked on the job: the assigned installer and whoever is signed in. */
  people?: { id: string; name: string }[];
  /** A finish made without signal is waiting in the outbox. */
  finishQueued?: boolean;
}) {
  const crew = people ?? (sheet.job.installer ? [sheet.job.installer] : []);
  const [draft, setDraft] = useState(() => draftFromVanLoad(sheet.vanLoad, crew));
  // One key per finish of this job on this phone: a resend (online retry or from the outbox) is recorded once.
  const [finishKey] = useState(() => newKey());
  const [reasons, setReasons] = useState<Record<string, string>>({});
  const [writing, setWriting] = useState(false);
  const [confirmingEarly, setConfirmingEarly] = useState(false);
  const bookedLater = !!sheet.job.installDate && sheet.job.installDate > localToday();
  const finish = useFinishJob(sheet.job.id, finishKey);
  const blockers = finishBlockers(sheet, ticks, reasons, pendingPhotos);
  const unticked = finishBlockers(sheet, ticks, {}, pendingPhotos).checks;
  const asked = askedParts(sheet.actualsRequired, sheet.vanLoad, crew);
  const unrecorded = missingParts(asked, draft);
  const ready = blockers.checks.length === 0 && blockers.photos.length === 0 && unrecorded.length === 0;
  const submit = () => finish.mutate({ reasons: Object.fromEntries(Object.entries(reasons).filter(([, v]) => v.trim())), actuals: actualsFromDraft(draft) });
  if (finish.data?.queued || finishQueued)
    return (
      <SheetSection title="Finish the job">
        <p role="status" className="text-base font-semibold">
          No signal: marked installed on this phone. It is sent with what was used as soon as there is signal.
        </p>
      </SheetSection>
    );
  return (
    <SheetSection title="Finish the job">
      {ready && waiting === 0 && <p className="mb-2 text-base">Every check is ticked or explained and every space has an after photo.</p>}
      {unticked.length > 0 && (
        <div className="mb-3">
          <p className="text-base font-semibold">
            {unticked.length} check{unticked.length === 1 ? ' is' : 's are'} not ticked. Tick {unticked.length === 1 ? 'it' : 'them'} above, or write why{' '}
            {unticked.length === 1 ? 'it' : 'each'} could not be done.
          </p>
          {!writing ? (
            <button
              type="button"
              className="mt-2 min-h-11 rounded-md border-2 border-graphite/40 bg-white px-3 text-base font-semibold"
              onClick={() => setWriting(true)}
            >
              Write reasons
            </button>
          ) : (
            unticked.map((c) => (
              <label key={c.key} className="mt-2 block text-base">
                <span className="font-semibold">
                  {c.spaceName}: {c.title}
                </span>
                <textarea
                  rows={2}
                  value={reasons[c.key] ?? ''}
                  onChange={(e) => setReasons((r) => ({ ...r, [c.key]: e.target.value }))}
                  className="mt-1 w-full rounded-md border-2 border-graphite/40 bg-white p-2 text-base"
                />
              </label>
            ))
          )}
        </div>
      )}
      <ActualsForm load={sheet.vanLoad} people={crew} draft={draft} onChange={setDraft} required={asked} />
      {unrecorded.length > 0 && (
        <p className="mb-2 text-base font-semibold text-brick-dark">
          Fill in {unrecorded.map((p) => PART_TEXT[p]).join(' and ')}: the company asks for them before finishing.
        </p>
      )}
      {blockers.photos.length > 0 && (
        <p className="mb-2 text-base font-semibold text-brick-dark">Add at least one after photo of: {blockers.photos.join(', ')}.</p>
      )}
      {waiting > 0 && (
        <p className="mb-2 text-base">
          Waiting to send {waiting} change{waiting === 1 ? '' : 's'}: finish once they are sent.
        </p>
      )}
      {finish.error && (
        <p role="alert" className="mb-2 text-base font-semibold text-brick-dark">
          {isApiError(finish.error) ? finish.error.message : 'Could not mark the job installed.'}
        </p>
      )}
      {confirmingEarly ? (
        <div role="alertdialog" aria-labelledby="finish-early-title" className="rounded-md border-2 border-brick-dark bg-white p-3">
          <p id="finish-early-title" className="mb-3 text-base font-semibold">
            This job is booked for {formatDate(sheet.job.installDate)}, not today. Mark it installed today?
          </p>
          <div className="flex gap-2">
            <button
              type="button"
              disabled={finish.isPending}
              onClick={submit}
              className="min-h-12 flex-1 rounded-md bg-teal-dark px-3 text-base font-bold text-white disabled:bg-graphite/30"
            >
              {finish.isPending ? 'Marking installed…' : 'Yes, installed today'}
            </button>
            <button
              type="button"
              onClick={() => setConfirmingEarly(false)}
              className="min-h-12 flex-1 rounded-md border-2 border-graphite/40 bg-white px-3 text-base font-semibold"
            >
              Not yet
            </button>
          </div>
        </div>
      ) : (
        <button
          type="button"
          disabled={!ready || waiting > 0 || finish.isPending}
          onClick={() => (bookedLater ? setConfirmingEarly(true) : submit())}
          className="min-h-14 w-full rounded-md bg-teal-dark px-4 text-xl font-bold text-white disabled:bg-graphite/30 disabled:text-graphite"
        >
          {finish.isPending ? 'Marking installed…' : 'Mark installed'}
        </button>
      )}
    </SheetSection>
  );
}
