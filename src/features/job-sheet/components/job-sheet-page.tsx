import { useQueryClient } from '@tanstack/react-query';
import { useEffect, useMemo, useState } from 'react';
import { useParams } from 'react-router-dom';
import { ErrorState, LoadingState, StageBadge, formatAddress, formatDate } from '../../../components/ui';
import { useCurrentUser } from '../../auth';
import { can } from '../../../../shared/auth/policies';
import { useJobSheet } from '../api/get-job-sheet';
import { sheetKeys, sheetUrl } from '../api/keys';
import { recordNote, recordPhoto, recordTick } from '../api/record';
import { mergePending } from '../merge-pending';
import { onSent, startOutbox, useOutbox } from '../offline/outbox';
import type { OutboxItem } from '../offline/outbox-db';
import { keepForOffline } from '../offline/register-sw';
import { askedParts } from './actuals-form';
import { ActualsEditor } from './actuals-editor';
import { FinishPanel } from './finish-panel';
import { NotesPanel } from './notes-panel';
import { SheetSection } from './sheet-section';
import { SpaceBlock } from './space-block';
import { SyncStatus } from './sync-status';
import { VanLoad } from './van-load';
import '../dark-loft.css';

/**
 * The installer's job sheet, made first for a 360 px phone in a dim loft: large type, strong
 * contrast, big touch targets. Everything recorded here goes through the offline outbox.
 */
export default function JobSheetPage() {
  const { id = '' } = useParams();
  const me = useCurrentUser();
  const sheet = useJobSheet(id);
  const outbox = useOutbox();
  const qc = useQueryClient();
  const [offlineReady, setOfflineReady] = useState<'no' | 'saving' | 'yes'>('no');
  // Sent changes stay drawn until the sheet has been fetched again, so a tick does not blink off in between.
  const [sent, setSent] = useState<{ item: OutboxItem; at: number }[]>([]);

  useEffect(() => {
    startOutbox();
    const stop = onSent((item) => {
      if (item.jobId !== id) return;
      setSent((list) => [...list, { item, at: Date.now() }]);
      void qc.invalidateQueries({ queryKey: sheetKeys.sheet(id) });
    });
    return () => {
      stop();
    };
  }, [id, qc]);

  const loaded = !!sheet.data;
  useEffect(() => {
    if (!loaded || offlineReady !== 'no' || !navigator.onLine) return;
    // eslint-disable-next-line react-hooks/set-state-in-effect -- marks this effect's own request as started, so it is sent once
    setOfflineReady('saving');
    void keepForOffline(['/api/auth/me', '/api/my-jobs', sheetUrl(id)]).then((kept) => setOfflineReady(kept === null ? 'no' : 'yes'));
  }, [loaded, id, offlineReady]);

  const fetchedAt = sheet.dataUpdatedAt;
  const merged = useMemo(() => {
    if (!sheet.data) return null;
    const overlay = [...sent.filter((s) => s.at > fetchedAt).map((s) => s.item), ...outbox.items];
    return mergePending(sheet.data, overlay, { id: me.id, name: me.name });
  }, [sheet.data, fetchedAt, sent, outbox.items, me.id, me.name]);

  if (sheet.isPending) return <LoadingState label="Opening the job sheet…" />;
  if (sheet.isError || !sheet.data || !merged)
    return <ErrorState error={sheet.error} onRetry={() => sheet.refetch()} title="The job sheet could not be opened" />;
  const s = sheet.data;
  const closed = s.job.stage !== 'scheduled';
  const canRecord = !closed && can(me, 'sitework:record');
  const crew = [...(s.job.installer ? [s.job.installer] : []), ...(s.job.installer?.id === me.id ? [] : [{ id: me.id, name: me.name }])];

  return (
    <div className="mx-auto max-w-2xl text-lg leading-relaxed text-[#1d1f22]" data-dark-loft>
      <header className="mb-3">
        <div className="flex items-center justify-between gap-2">
          <span className="font-mono text-base font-semibold text-timber">{s.job.reference}</span>
          <StageBadge stage={s.job.stage} className="text-sm" />
        </div>
        <h1 className="mt-1 text-2xl font-bold leading-tight">{formatAddress(s.job.propertyAddress)}</h1>
        <p className="text-lg">
          {s.job.customer.name}
          {s.job.customer.phone && (
            <>
              {' · '}
              <a className="font-semibold text-teal-dark underline" href={`tel:${s.job.customer.phone.replace(/\s+/g, '')}`}>
                {s.job.customer.phone}
              </a>
            </>
          )}
        </p>
        <p className="text-base">
          {s.job.installDate ? `Install: ${formatDate(s.job.installDate)}` : 'No install date yet'}
          {s.job.installer && ` · ${s.job.installer.name}`}
        </p>
        {s.job.accessNotes && (
          <p className="mt-2 rounded-md border-2 border-graphite/30 bg-white px-3 py-2 text-lg">
            <strong>Access: </strong>
            {s.job.accessNotes}
          </p>
        )}
        <p className="mt-1 text-sm text-graphite-light" data-testid="offline-ready">
          {offlineReady === 'yes' ? 'Saved on this device: opens without signal.' : offlineReady === 'saving' ? 'Saving for offline use…' : ''}
        </p>
      </header>

      <div className="sticky top-14 z-20 -mx-4 bg-paper px-4 pt-1">
        <SyncStatus jobId={s.job.id} />
      </div>

      {s.completion && (
        <p className="mb-3 rounded-md border-2 border-teal-dark bg-teal-light/40 px-3 py-2 text-lg font-semibold">
          Marked installed by {s.completion.by.name}, {formatDate(s.completion.at)}.{' '}
          {can(me, 'jobs:read-all') && (
            <a className="underline" href={s.completion.handoverUrl}>
              Handover pack (PDF)
            </a>
          )}
        </p>
      )}

      <SheetSection title="Safety first" defaultOpen>
        <ul className="list-disc space-y-1 pl-5 text-base">
          {s.cautions.map((c) => (
            <li key={c}>{c}</li>
          ))}
        </ul>
      </SheetSection>

      {s.spaces.map((space) => (
        <SpaceBlock
          key={space.id}
          space={space}
          ticks={merged.ticks}
          photos={s.photos}
          pendingPhotos={merged.pendingPhotos}
          canRecord={canRecord}
          onTick={(kind, ref, done, reason = '') => void recordTick(s.job.id, { kind, spaceId: space.id, ref, done, reason })}
          onPhoto={(file, stage, caption) => void recordPhoto(s.job.id, { file, fileName: file.name || 'photo.jpg', spaceId: space.id, stage, caption })}
        />
      ))}

      <SheetSection title="Van load" defaultOpen>
        <VanLoad load={s.vanLoad} />
      </SheetSection>

      <SheetSection title={`Notes (${merged.notes.length})`} defaultOpen>
        {s.job.notes && <p className="mb-2 rounded-md bg-white/80 p-2 text-base">Office: {s.job.notes}</p>}
        <NotesPanel notes={merged.notes} onAdd={canRecord ? (text) => void recordNote(s.job.id, { text }) : undefined} />
      </SheetSection>

      {canRecord && (
        <FinishPanel
          sheet={s}
          ticks={merged.ticks}
          pendingPhotos={merged.pendingPhotos}
          waiting={outbox.items.filter((i) => i.jobId === s.job.id && i.status === 'waiting' && i.kind !== 'finish').length}
          finishQueued={outbox.items.some((i) => i.jobId === s.job.id && i.kind === 'finish' && i.status === 'waiting')}
          people={crew}
        />
      )}

      {s.actuals && (
        <SheetSection title="What was used" defaultOpen={s.actuals.editable}>
          <ActualsEditor
            jobId={s.job.id}
            load={s.vanLoad}
            people={crew}
            stored={s.actuals}
            editable={s.actuals.editable}
            required={askedParts(s.actualsRequired, s.vanLoad, crew)}
            onSaved={() => qc.invalidateQueries({ queryKey: sheetKeys.sheet(s.job.id) })}
          />
          {!s.actuals.editable && <p className="mt-2 text-sm text-graphite-light">The job is invoiced or closed: ask the office to correct anything.</p>}
        </SheetSection>
      )}
    </div>
  );
}
