import { formatDateTime } from '../../../../shared/dates';
import type { ShownTick } from '../merge-pending';

/** A large two-state button for ticking something off on site; shows who ticked it and when. */
export function TickButton({
  label,
  tick,
  onToggle,
  testId,
}: {
  label: string;
  tick: ShownTick | undefined;
  onToggle: (done: boolean) => void;
  testId?: string;
}) {
  const done = !!tick?.done;
  return (
    <button
      type="button"
      aria-pressed={done}
      data-testid={testId}
      onClick={() => onToggle(!done)}
      className={`inline-flex min-h-11 min-w-[5.5rem] items-center justify-center gap-1 rounded-md border-2 px-3 text-base font-bold ${
        done ? 'border-teal-dark bg-teal-dark text-white' : 'border-graphite/50 bg-white text-graphite'
      }`}
    >
      <span aria-hidden>{done ? '✓' : '○'}</span>
      {label}
      {tick?.pending && <span className="sr-only"> (waiting to send)</span>}
    </button>
  );
}

export function tickedByLine(tick: ShownTick | undefined): string {
  if (!tick) return '';
  const when = formatDateTime(tick.at);
  return `${tick.done ? 'Ticked' : 'Reason given'} by ${tick.by.name}, ${when}${tick.pending ? ' · waiting to send' : ''}`;
}
