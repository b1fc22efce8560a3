import { Button, formatDateTime } from '../../../components/ui';
import type { MailRecord } from '../../../../shared/api/mail';
import { useMailRecords, useResendMail } from '../api/mail-records';

const STATUS_TEXT: Record<MailRecord['status'], string> = { waiting: 'Waiting to be sent', sent: 'Sent', failed: 'Not sent' };
const STATUS_CLASS: Record<MailRecord['status'], string> = { waiting: 'text-amber-700', sent: 'text-emerald-700', failed: 'text-red-700' };

/** Every message the company sent or is sending, with its status; a failed one can be sent again. */
export function MailStatusList() {
  const records = useMailRecords();
  const resend = useResendMail();
  const messages = records.data?.messages ?? [];
  if (messages.length === 0) return null;
  return (
    <section className="mb-6" aria-label="Sending status">
      <h2 className="mb-2 text-sm font-semibold text-graphite">Sending status</h2>
      <ul className="flex flex-col divide-y divide-paper-line rounded-lg border border-paper-line bg-white/85">
        {messages.map((m) => (
          <li key={m.id} className="flex flex-col gap-1 px-4 py-2 text-sm sm:flex-row sm:items-center sm:gap-4" data-testid="mail-record">
            <span className="min-w-0 flex-1 truncate">{m.subject}</span>
            <span className="truncate text-graphite-light">to {m.to}</span>
            <span className="shrink-0 font-mono text-xs text-graphite-light">{formatDateTime(m.sentAt ?? m.createdAt)}</span>
            <span className={`shrink-0 font-medium ${STATUS_CLASS[m.status]}`} title={m.lastError ?? undefined}>
              {STATUS_TEXT[m.status]}
              {m.status !== 'sent' && m.lastError ? ` — ${m.lastError}` : ''}
            </span>
            {m.status === 'failed' && (
              <Button size="sm" variant="secondary" busy={resend.isPending && resend.variables === m.id} onClick={() => resend.mutate(m.id)}>
                Send again
              </Button>
            )}
          </li>
        ))}
      </ul>
    </section>
  );
}
