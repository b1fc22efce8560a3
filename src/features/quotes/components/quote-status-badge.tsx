import type { QuoteStatus } from '../../../../shared/api/quotes';

const TONES: Record<QuoteStatus, string> = {
  draft: 'bg-paper-dark text-graphite',
  sent: 'bg-sky-light text-graphite',
  accepted: 'bg-teal-light text-teal-dark',
  declined: 'bg-brick-light/50 text-brick-dark',
  expired: 'bg-straw-light text-graphite',
  superseded: 'bg-paper-dark text-graphite-light line-through',
};

export function QuoteStatusBadge({ status }: { status: QuoteStatus }) {
  return (
    <span className={`rounded-full px-2.5 py-0.5 text-xs font-semibold uppercase tracking-wide ${TONES[status]}`} data-testid="quote-status">
      {status}
    </span>
  );
}
