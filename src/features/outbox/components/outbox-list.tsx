import { useState } from 'react';
import { formatDateTime } from '../../../components/ui';
import type { OutboxMessage } from '../../../../shared/api/outbox';
import { LinkifiedText } from './linkified-text';

/** The caught e-mails, newest first; the first one open, the others expand on click. */
export function OutboxList({ messages }: { messages: OutboxMessage[] }) {
  const [open, setOpen] = useState<number | null>(messages[0]?.id ?? null);
  return (
    <ul className="flex flex-col gap-2" aria-label="Caught e-mails">
      {messages.map((m) => {
        const isOpen = open === m.id;
        return (
          <li key={m.id} className="rounded-lg border border-paper-line bg-white/85 shadow-sm">
            <button
              type="button"
              className="flex w-full flex-col gap-0.5 px-4 py-3 text-left sm:flex-row sm:items-baseline sm:gap-4"
              aria-expanded={isOpen}
              onClick={() => setOpen(isOpen ? null : m.id)}
            >
              <span className="min-w-0 flex-1 truncate font-medium">{m.subject}</span>
              <span className="truncate text-sm text-graphite-light">to {m.to}</span>
              <span className="shrink-0 font-mono text-xs text-graphite-light">{formatDateTime(m.receivedAt)}</span>
            </button>
            {isOpen && (
              <div className="border-t border-paper-line px-4 py-3">
                {m.from && <div className="text-xs text-graphite-light">from {m.from}</div>}
                <div className="mb-2 text-xs text-graphite-light" data-testid="outbox-reply-to">
                  {m.replyTo ? `replies go to ${m.replyTo}` : 'no Reply-To: replies go to the sender'}
                </div>
                <pre className="whitespace-pre-wrap break-words font-mono text-[13px] leading-relaxed text-graphite">
                  <LinkifiedText text={m.text || '(no text body)'} />
                </pre>
              </div>
            )}
          </li>
        );
      })}
    </ul>
  );
}
