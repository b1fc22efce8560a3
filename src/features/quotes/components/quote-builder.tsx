import { useMemo } from 'react';
import { FormProvider, useWatch } from 'react-hook-form';
import { Link } from 'react-router-dom';
import type { Quote } from '../../../../shared/api/quotes';
import { can } from '../../../../shared/auth/policies';
import { computeQuoteTotals } from '../../../../shared/quote/totals';
import { Alert, Button, Card, CardTitle, Input, PageHeader, Textarea, formatDate, formatDateTime } from '../../../components/ui';
import { isApiError } from '../../../lib/api-client';
import { asSentence } from '../../../lib/form-errors';
import { FormField, hasFieldErrors, setErrorOnSentRows, showServerErrors, useZodForm } from '../../../lib/forms';
import { useCurrentUser } from '../../auth';
import { DepositStatus } from '../../invoices';
import { useSendQuote } from '../api/send-quote';
import { useUpdateQuote } from '../api/update-quote';
import { keptRows, quoteFormSchema, quoteFormValues } from './quote-form-schema';
import { QuoteLinesEditor } from './quote-lines-editor';
import { QuoteStatusBadge } from './quote-status-badge';
import { QuoteTotalsPanel } from './quote-totals-panel';

type Props = {
  quote: Quote;
  jobId: string;
  message: string | null;
  onMessage: (message: string | null) => void;
  /** The quote the server saved: this one, or a new version when this one had been sent. */
  onSaved: (saved: Quote) => void;
};

/** The quote builder: lines, totals, tax by rate, margin, valid-until, saving; save, send, download. */
export function QuoteBuilder({ quote: q, jobId, message, onMessage, onSaved }: Props) {
  const user = useCurrentUser();
  const update = useUpdateQuote(q.id);
  const send = useSendQuote(q.id);
  const schema = useMemo(() => quoteFormSchema(q.currency, q.locale), [q.currency, q.locale]);
  const form = useZodForm(schema, { defaultValues: quoteFormValues(q), mode: 'onChange' });
  // What the stored quote sends, to tell whether anything was changed (retyping "12" as "12.0" is not a change).
  const stored = useMemo(() => JSON.stringify(schema.parse(quoteFormValues(q))), [schema, q]);

  const [lines, validUntil, notes] = useWatch({ control: form.control, name: ['lines', 'validUntil', 'notes'] });
  const checked = useMemo(() => schema.safeParse({ lines, validUntil, notes }), [schema, lines, validUntil, notes]);
  const totals = useMemo(() => {
    if (!checked.success) return null;
    try {
      return computeQuoteTotals(checked.data.lines, q.taxRates, q.issueDate);
    } catch {
      return null;
    }
  }, [checked, q.taxRates, q.issueDate]);
  // Priced lines are the kept rows in order; a blank row (left out) has no price.
  const kept = keptRows(lines, q.currency, q.locale);
  const priced = totals ? lines.map((_, i) => (kept.includes(i) ? totals.lines[kept.indexOf(i)] : null)) : null;

  const editable = q.status === 'draft' || (can(user, 'quotes:manage') && ['sent', 'expired', 'declined'].includes(q.status));
  const canSend = can(user, 'quotes:manage') && (q.status === 'draft' || q.status === 'sent');
  const dirty = !checked.success || JSON.stringify(checked.data) !== stored;

  const save = form.handleSubmit(async (body) => {
    onMessage(null);
    // The server numbers the lines it was sent; blank rows were left out, so its "lines.N" is the Nth kept row.
    const onRow = setErrorOnSentRows(form.setError, 'lines', keptRows(form.getValues('lines'), q.currency, q.locale));
    try {
      onSaved(await update.mutateAsync(body));
    } catch (err) {
      showServerErrors(err, onRow);
    }
  });
  async function doSend() {
    onMessage(null);
    const r = await send.mutateAsync(undefined);
    onMessage(`Sent to the customer with the PDF and a private link: ${r.link}`);
  }
  const saveProblem = form.formState.errors.root?.server?.message;
  const fieldsNeedAttention = form.formState.isSubmitted && hasFieldErrors(form.formState.errors);

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
      {saveProblem && <Alert>{asSentence(saveProblem)}</Alert>}
      {fieldsNeedAttention && !saveProblem && <Alert>Some fields need attention.</Alert>}
      {send.error && <Alert>{isApiError(send.error) || send.error instanceof Error ? send.error.message : 'Something went wrong.'}</Alert>}
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
          <FormProvider {...form}>
            <form onSubmit={(e) => void save(e)} noValidate>
              <QuoteLinesEditor priced={priced} currency={q.currency} locale={q.locale} readOnly={!editable} />
              <div className="mt-4 grid grid-cols-1 gap-3 sm:grid-cols-[12rem_minmax(0,1fr)]">
                <FormField name="validUntil" label="Valid until">
                  <Input type="date" disabled={!editable} {...form.register('validUntil')} />
                </FormField>
                <FormField name="notes" label="Note printed on the quote">
                  <Textarea rows={2} disabled={!editable} {...form.register('notes')} />
                </FormField>
              </div>
              <div className="mt-4 flex flex-wrap gap-2">
                {editable && (
                  <Button type="submit" busy={update.isPending} disabled={!dirty}>
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
            </form>
          </FormProvider>
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
