import { useState } from 'react';
import { FormProvider } from 'react-hook-form';
import { z } from 'zod';
import { invoiceCreateSchema } from '../../../../shared/api/invoices';
import { Link, useNavigate } from 'react-router-dom';
import type { JobStage } from '../../../../shared/api/jobs';
import { formatMoney } from '../../../../shared/quote/money';
import { Alert, Button, Card, CardTitle, ErrorState, Spinner, Textarea, formatDateTime } from '../../../components/ui';
import { asSentence } from '../../../lib/form-errors';
import { useCreateInvoice } from '../api/create-invoice';
import { usePaymentTimeline } from '../api/get-deposit';
import { useInvoices } from '../api/get-invoices';
import { usePaymentSettings } from '../api/payment-settings';
import { useSiteNotes } from '../api/get-site-notes';
import { InvoiceStatusBadge } from './invoice-status-badge';
import { LineEditor } from './line-editor';
import { linesFormSchema } from './line-form-schema';
import { showServerErrors, useZodForm } from '../../../lib/forms';

/** The job's money: deposit, invoice and payments on one card, and "Create invoice" once installed. */
export function JobMoneyCard({
  jobId,
  stage,
  canInvoice,
  hasAcceptedQuote,
}: {
  jobId: string;
  stage: JobStage;
  canInvoice: boolean;
  /** Undefined while the job's quotes load: nothing is offered until it is known. */
  hasAcceptedQuote: boolean | undefined;
}) {
  const timeline = usePaymentTimeline(jobId);
  // Invoices are office-only (quotes:manage on the API); an estimator asking would get a 403.
  const invoices = useInvoices({ jobId }, { enabled: canInvoice });
  const invoice = invoices.data?.find((i) => i.kind === 'invoice');
  return (
    <Card>
      <CardTitle>Payments</CardTitle>
      {timeline.isPending ? (
        <Spinner size="sm" label="Loading payments" />
      ) : timeline.isError ? (
        <ErrorState error={timeline.error} onRetry={() => timeline.refetch()} title="Payments could not be loaded" />
      ) : timeline.data.length === 0 ? (
        <p className="text-sm text-graphite-light">No deposit or invoice yet.</p>
      ) : (
        <ol className="flex flex-col gap-1.5 text-sm" data-testid="money-timeline">
          {timeline.data.map((e, i) => (
            <li key={i} className="flex flex-wrap justify-between gap-x-3">
              <span>{e.text}</span>
              <span className="font-mono text-xs text-graphite-light">{formatDateTime(e.at)}</span>
            </li>
          ))}
        </ol>
      )}
      {invoice && (
        <p className="mt-3 flex items-center gap-2 text-sm">
          Invoice{' '}
          <Link className="font-mono text-teal-dark hover:underline" to={`/invoices/${invoice.id}`}>
            {invoice.number}
          </Link>
          <InvoiceStatusBadge invoice={invoice} />{' '}
          {invoice.status !== 'paid' && <span className="font-mono">{formatMoney(invoice.balanceMinor, invoice.currency)} to pay</span>}
        </p>
      )}
      {canInvoice && !invoice && invoices.isSuccess && (stage === 'installed' || stage === 'closed') && hasAcceptedQuote && <NewInvoiceForm jobId={jobId} />}
      {canInvoice && !invoice && invoices.isSuccess && (stage === 'installed' || stage === 'closed') && hasAcceptedQuote === false && (
        <p className="mt-3 text-sm text-graphite-light" data-testid="invoice-needs-quote">
          No accepted quote on this job, so there is nothing to invoice from yet: an invoice is made from the quote the customer accepted, plus variations.
          Build and send a quote first.
        </p>
      )}
      {canInvoice && !invoice && invoices.isSuccess && stage !== 'installed' && stage !== 'closed' && (
        <p className="mt-3 text-xs text-graphite-light">The invoice is made once the job is installed.</p>
      )}
    </Card>
  );
}

const newInvoiceSchema = (currency: string) => z.object({ variations: linesFormSchema(currency), notes: invoiceCreateSchema.shape.notes });

function NewInvoiceForm({ jobId }: { jobId: string }) {
  const create = useCreateInvoice();
  const currency = usePaymentSettings().data?.settings.currency ?? 'GBP';
  const navigate = useNavigate();
  const [open, setOpen] = useState(false);
  const form = useZodForm(newInvoiceSchema(currency), { defaultValues: { variations: [], notes: '' } });
  const siteNotes = useSiteNotes(jobId, open);
  if (!open) {
    return (
      <div className="mt-3">
        <Button onClick={() => setOpen(true)}>Create invoice</Button>
      </div>
    );
  }
  const submit = form.handleSubmit(async (body) => {
    let id: string;
    try {
      // Awaited here, not in mutate's onSuccess: the refetch after creating unmounts this form (the job now has an invoice).
      id = (await create.mutateAsync({ jobId, ...body, send: true })).id;
    } catch (err) {
      showServerErrors(err, form.setError);
      return;
    }
    navigate(`/invoices/${id}`);
  });
  const problem = form.formState.errors.root?.server?.message;
  return (
    <FormProvider {...form}>
      <form onSubmit={submit} noValidate className="mt-4 flex flex-col gap-3 border-t border-paper-line pt-3">
        <p className="text-sm text-graphite-light">
          The invoice takes the accepted quote's lines, adds any variations below (see the installer's site notes), takes off the deposit paid, and is e-mailed
          to the customer with a link to pay.
        </p>
        {siteNotes.isSuccess && siteNotes.data.length > 0 && (
          <div className="rounded-md border border-paper-line bg-paper/60 px-3 py-2 text-sm" data-testid="site-notes">
            <p className="mb-1 font-medium">The installer's notes from site</p>
            <ul className="list-disc pl-5">
              {siteNotes.data.map((n) => (
                <li key={n.id}>
                  {n.text}{' '}
                  <span className="text-xs text-graphite-light">
                    — {n.by.name}, {formatDateTime(n.at)}
                  </span>
                </li>
              ))}
            </ul>
          </div>
        )}
        <LineEditor name="variations" label="Variations found on site" />
        <Textarea aria-label="Notes printed on the invoice" placeholder="Notes printed on the invoice (optional)" rows={2} {...form.register('notes')} />
        {problem && <Alert>{asSentence(problem)}</Alert>}
        <div className="flex gap-2">
          <Button type="submit" busy={create.isPending}>
            Create and e-mail invoice
          </Button>
          <Button variant="ghost" onClick={() => setOpen(false)}>
            Cancel
          </Button>
        </div>
      </form>
    </FormProvider>
  );
}
