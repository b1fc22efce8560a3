import type { JobEvent, JobStage } from '../../../../shared/api/jobs';
import { JOB_STAGES } from '../../../../shared/api/jobs';
import { Card, CardTitle, ErrorState, Spinner, STAGE_LABELS, formatDate, formatDateTime } from '../../../components/ui';
import { useJobEvents } from '../api/get-job-events';

const stageLabel = (v: unknown) => ((JOB_STAGES as readonly unknown[]).includes(v) ? STAGE_LABELS[v as JobStage] : String(v ?? '—'));

/** One line of plain words for an event; unknown kinds (added by other modules) fall back to their name. */
export function describeEvent(e: JobEvent): string {
  const d = e.data ?? {};
  switch (e.kind) {
    case 'created':
      return `Job created${d.reference ? ` as ${d.reference}` : ''}`;
    case 'stage_changed':
      return `Stage ${stageLabel(d.from)} → ${stageLabel(d.to)}`;
    case 'assigned':
      return d.to ? 'Installer assigned' : 'Installer unassigned';
    case 'scheduled': {
      // Editing the job records `{ from, to }`; booking on the schedule records `{ from, installerId, date }`.
      const to = d.to ?? d.date;
      return to ? `Install date set to ${formatDate(String(to))}` : 'Install date cleared';
    }
    case 'updated':
      return 'Details edited';
    default:
      // Modules that add events may carry their own sentence (payments: `paymentText`, with amounts,
      // which the server strips for installers like every price-like key).
      if (typeof d.paymentText === 'string' && d.paymentText) return d.paymentText;
      if (typeof d.text === 'string' && d.text) return d.text;
      return e.kind.replace(/[_-]+/g, ' ').replace(/^./, (c) => c.toUpperCase());
  }
}

/** The job's history, newest first. */
export function JobTimeline({ jobId }: { jobId: string }) {
  const events = useJobEvents(jobId);
  return (
    <Card>
      <CardTitle>History</CardTitle>
      {events.isPending ? (
        <Spinner size="sm" label="Loading history" className="text-graphite-light" />
      ) : events.isError ? (
        <ErrorState error={events.error} onRetry={() => events.refetch()} title="The history could not be loaded" />
      ) : events.data.length === 0 ? (
        <p className="text-sm text-graphite-light">Nothing recorded yet.</p>
      ) : (
        <ol className="relative ml-1.5 border-l border-paper-line">
          {[...events.data].reverse().map((e) => (
            <li key={e.id} className="relative pb-3 pl-4 last:pb-0">
              <span aria-hidden className="absolute -left-[5px] top-1.5 h-2.5 w-2.5 rounded-full border-2 border-paper bg-timber-light" />
              <div className="text-sm">{describeEvent(e)}</div>
              <div className="font-mono text-xs text-graphite-light">
                {formatDateTime(e.createdAt)}
                {e.user ? ` · ${e.user.name}` : ''}
              </div>
            </li>
          ))}
        </ol>
      )}
    </Card>
  );
}
