import { useMemo, useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { can } from '../../../../shared/auth/policies';
import { computeQuoteTotals } from '../../../../shared/quote/totals';
import {
  Alert,
  Button,
  Card,
  CardTitle,
  ErrorState,
  Field,
  Input,
  LoadingState,
  PageHeader,
  Textarea,
  formatDate,
  formatDateTime,
} from '../../../components/ui';
import { isApiError } from '../../../lib/api-client';
import { useCurrentUser } from '../../auth';
import { useQuote } from '../api/get-quote';
import { useSendQuote } from '../api/send-quote';
import { useUpdateQuote } from '../api/update-quote';
import { parseDraft, toDraft, type DraftLine } from './draft-lines';
import { QuoteLinesEditor } from './quote-lines-editor';
import { QuoteStatusBadge } from './quote-status-badge';
import { QuoteTotalsPanel } from './quote-totals-panel';
import { DepositStatus } from '../../invoices';

/** The quote builder: lines, totals, tax by rate, margin, valid-until, saving; save, send, download. */
export default function QuotePage() {
  const { id: jobId = '', quoteId = '' } = useParams();
  const user = useCurrentUser();
  const navigate = useNavigate();
  const quote = useQuote(quoteId);
  const update = useUpdateQuote(quoteId);
  const send = useSendQuote(quoteId);
  const [lines, setLines] = useState<DraftLine[] | null>(null);
  const [validUntil, setValidUntil] = useState('');
  const [notes, setNotes] = useState('');
  const [message, setMessage] = useState<string | null>(null);

  // Each quote version from the server resets the draft (adjusted during render, not in an effect).
  const [shown, setShown] = useState<typeof quote.data>(undefined);
  if (quote.data !== shown) {
    setShown(quote.data);
    if (quote.data) {
      setLines(toDraft(quote.data));
      setValidUntil(quote.data.validUntil);
      setNotes(quote.data.notes);
    }
  }

  const q = quote.data;
  const parsed = useMemo(() => (q && lines ? parseDraft(lines, q.currency, q.locale) : null), [q, lines]);
  const totals = useMemo(() => {
    if (!q || !parsed || parsed.problems.length) return null;
    try {
      return computeQuoteTotals(parsed.inputs, q.taxRates, q.issueDate);
    } catch {
      return null;
    }
  }, [q, parsed]);

  // The error first: a failed load never fills `lines`, and would otherwise spin for ever.
  if (quote.isError) return <ErrorState error={quote.error} onRetry={() => quote.refetch()} title="The quote could not be loaded" />;
  if (quote.isPending || !lines) return <LoadingState label="Loading the quote…" />;
  if (!q || !parsed) return null;

  const editable = q.status === 'draft' || (can(user, 'quotes:manage') && ['sent', 'expired', 'declined'].includes(q.status));
  const canSend = can(user, 'quotes:manage') && (q.status === 'draft' || q.status === 'sent');
  const dirty =
    JSON.stringify(parsed.body) !== JSON.stringify(parseDraft(toDraft(q), q.currency, q.locale).body) || validUntil !== q.validUntil || notes !== q.notes;

  async function save() {
    setMessage(null);
    if (parsed!.problems.length) return;
    const saved = await update.mutateAsync({ lines: parsed!.body, validUntil, notes });
    if (saved.id !== q!.id) {
      setMessage(`Saved as version ${saved.version}; version ${q!.version} is kept as it was sent.`);
      navigate(`/jobs/${jobId}/quotes/${saved.id}`, { replace: true });
    } else setMessage('Saved.');
  }
  async function doSend() {
    setMessage(null);
    const r = await send.mutateAsync(undefined);
    setMessage(`Sent to the customer with the PDF and a private link: ${r.link}`);
  }
  const error = update.error ?? send.error;

  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        eyebrow={<Link to={`/jobs/${jobId}`}>← Back to the job</Link>}
        title={
          <span className="flex flex-wrap items-center gap-3">
            Quote {q.number}
            {q.version > 1 && <span className="font-mono text-base text-graphite-light">v{q.version}</span>}
            <QuoteStatusBadge status={q.status} />
          </span>
        }
        subtitle={`Issued ${formatDate(q.issueDate)} · valid until ${formatDate(q.validUntil)}${q.sentAt ? ` · sent ${formatDateTime(q.sentAt)}` : ''}`}
        actions={
          <>
            <a className="rounded-md border border-graphite/25 bg-white/70 px-3 py-2 text-sm" href={`/api/quotes/${q.id}/pdf`} target="_blank" rel="noreferrer">
              PDF
            </a>
            <a className="rounded-md border border-graphite/25 bg-white/70 px-3 py-2 text-sm" href={`/api/quotes/${q.id}/csv`} download>
              CSV
            </a>
            <a className="rounded-md border border-graphite/25 bg-white/70 px-3 py-2 text-sm" href={`/api/quotes/${q.id}/xlsx`} download>
              XLSX
            </a>
          </>
        }
      />
      {message && (
        <Alert tone="success">
          <span className="break-all">{message}</span>
        </Alert>
      )}
      {error && <Alert>{isApiError(error) || error instanceof Error ? error.message : 'Something went wrong.'}</Alert>}
      {q.warnings.length > 0 && (
        <Alert tone="caution">
          <ul className="list-disc pl-5">
            {q.warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </Alert>
      )}
      {(q.status === 'sent' || q.status === 'accepted') && <DepositStatus quoteId={q.id} />}
      {q.status === 'accepted' && (
        <Alert tone="success">
          Accepted by {q.acceptedName} on {q.acceptedAt ? formatDateTime(q.acceptedAt) : ''}.
        </Alert>
      )}
      {q.status === 'declined' && <Alert tone="info">Declined{q.declineReason ? `: “${q.declineReason}”` : ''}.</Alert>}
      {q.status === 'sent' && editable && <Alert tone="info">This quote has been sent. Saving changes makes a new version; the sent one is kept.</Alert>}

      <div className="grid grid-cols-1 gap-4 xl:grid-cols-[minmax(0,3fr)_minmax(0,1fr)]">
        <Card>
          <CardTitle>Lines</CardTitle>
          <QuoteLinesEditor
            lines={lines}
            priced={totals?.lines ?? null}
            problems={parsed.problems}
            currency={q.currency}
            locale={q.locale}
            readOnly={!editable}
            onChange={setLines}
          />
          <div className="mt-4 grid grid-cols-1 gap-3 sm:grid-cols-[12rem_minmax(0,1fr)]">
            <Field label="Valid until">
              <Input type="date" value={validUntil} disabled={!editable} onChange={(e) => setValidUntil(e.target.value)} />
            </Field>
            <Field label="Note printed on the quote">
              <Textarea rows={2} value={notes} disabled={!editable} onChange={(e) => setNotes(e.target.value)} />
            </Field>
          </div>
          <div className="mt-4 flex flex-wrap gap-2">
            {editable && (
              <Button onClick={() => void save().catch(() => undefined)} busy={update.isPending} disabled={!dirty || parsed.problems.length > 0}>
                {q.status === 'draft' ? 'Save changes' : 'Save as a new version'}
              </Button>
            )}
            {canSend && (
              <Button variant="secondary" onClick={() => void doSend().catch(() => undefined)} busy={send.isPending} disabled={dirty}>
                {q.status === 'sent' ? 'Send again' : 'Send to the customer'}
              </Button>
            )}
            {dirty && canSend && <span className="self-center text-xs text-graphite-light">Save the changes before sending.</span>}
          </div>
        </Card>
        <div className="flex flex-col gap-4">
          <QuoteTotalsPanel
            totals={totals}
            currency={q.currency}
            locale={q.locale}
            saving={q.saving}
            siteHours={q.siteHours}
            showMargin={can(user, 'prices:read')}
            deposit={q.deposit}
          />
          {q.versions.length > 1 && (
            <Card>
              <CardTitle>Versions</CardTitle>
              <ul className="text-sm">
                {q.versions.map((v) => (
                  <li key={v.id}>
                    {v.id === q.id ? (
                      <strong>v{v.version}</strong>
                    ) : (
                      <Link className="text-teal-dark underline" to={`/jobs/${jobId}/quotes/${v.id}`}>
                        v{v.version}
                      </Link>
                    )}{' '}
                    · {v.status}
                  </li>
                ))}
              </ul>
            </Card>
          )}
          <Card>
            <CardTitle>Cautions on the quote</CardTitle>
            <ul className="list-disc pl-5 text-sm text-graphite-light">
              {q.cautions.map((c) => (
                <li key={c}>{c}</li>
              ))}
            </ul>
          </Card>
        </div>
      </div>
    </div>
  );
}
