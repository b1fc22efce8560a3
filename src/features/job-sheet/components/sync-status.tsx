import { useOutbox } from '../offline/outbox';

/** "N waiting to send" / "All sent", plus any change the server refused. Always visible on the installer's pages. */
export function SyncStatus({ jobId }: { jobId?: string }) {
  const { items, online, sending, lastError } = useOutbox();
  const mine = jobId ? items.filter((i) => i.jobId === jobId) : items;
  const waiting = mine.filter((i) => i.status === 'waiting').length;
  const failed = mine.filter((i) => i.status === 'failed');
  const tone = waiting > 0 ? 'border-straw-dark bg-straw-light text-graphite' : 'border-teal-dark bg-teal-light/50 text-graphite';
  return (
    <div className={`mb-3 rounded-md border-2 px-3 py-2 text-base font-semibold ${tone}`} role="status" aria-live="polite" data-testid="sync-status">
      <span data-testid="waiting-count">{waiting}</span> waiting to send
      {waiting === 0 ? ' · all sent' : sending && online ? ' · sending…' : ''}
      {!online && <span className="ml-1 font-normal">· offline: changes are kept on this device</span>}
      {lastError && waiting > 0 && online && <div className="text-sm font-normal">{lastError}</div>}
      {failed.length > 0 && (
        <div className="mt-1 text-sm font-normal text-brick-dark">
          {failed.length} change{failed.length === 1 ? ' was' : 's were'} refused: {failed[0].error}
        </div>
      )}
    </div>
  );
}
