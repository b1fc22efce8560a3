import { Link, useParams } from 'react-router-dom';
import type { Invoice } from '../../../../shared/api/invoices';
import { formatMoney } from '../../../../shared/quote/money';
import { formatRateBp } from '../../../../shared/quote/tax';
import {
  Alert,
  Button,
  Card,
  CardTitle,
  ErrorState,
  LoadingState,
  PageHeader,
  Table,
  TBody,
  Td,
  Th,
  THead,
  Tr,
  buttonClass,
  formatDate,
  formatDateTime,
} from '../../../components/ui';
import { isApiError } from '../../../lib/api-client';
import { asSentence } from '../../../lib/form-errors';
import { invoicePdfUrl, useInvoice } from '../api/get-invoice';
import { useSendInvoice } from '../api/update-invoice';
import { CreditNoteForm } from './credit-note-form';
import { InvoiceEditForm } from './invoice-edit-form';
import { InvoiceStatusBadge } from './invoice-status-badge';

/** Office: one invoice or credit note — lines, totals, what is left to pay, and what can still be done. */
export default function InvoicePage() {
  const { id = '' } = useParams();
  const invoice = useInvoice(id);
  if (invoice.isPending) return <LoadingState label="Loading the invoice…" />;
  if (invoice.isError) {
    return (
      <ErrorState
        error={invoice.error}
        onRetry={() => invoice.refetch()}
        title={isApiError(invoice.error) && invoice.error.status === 404 ? 'No such invoice' : 'The invoice could not be loaded'}
      />
    );
  }
  const inv = invoice.data;
  const isInvoice = inv.kind === 'invoice';
  const editable = isInvoice && inv.status !== 'paid' && inv.creditNotes.length === 0;
  return (
    <div className="flex flex-col gap-4">
      <PageHeader
        eyebrow={isInvoice ? 'Invoice' : 'Credit note'}
        title={
          <span className="flex flex-wrap items-center gap-3">
            <span className="font-mono">{inv.number}</span> <InvoiceStatusBadge invoice={inv} />
          </span>
        }
        subtitle={
          <>
            {inv.customerName} · job{' '}
            <Link className="underline-offset-2 hover:underline" to={`/jobs/${inv.jobId}`}>
              {inv.jobReference}
            </Link>
            {inv.quoteReference ? ` · quote ${inv.quoteReference}` : ''}
            {inv.creditedInvoiceId ? (
              <>
                {' '}
                · credits{' '}
                <Link className="underline-offset-2 hover:underline" to={`/invoices/${inv.creditedInvoiceId}`}>
                  {inv.creditedInvoiceNumber}
                </Link>
              </>
            ) : null}
          </>
        }
        actions={
          <>
            <a className={buttonClass('secondary')} href={invoicePdfUrl(inv.id)} target="_blank" rel="noreferrer">
              Open the PDF
            </a>
            <SendButton invoice={inv} />
          </>
        }
      />
      <Summary inv={inv} />
      <Lines inv={inv} />
      {editable && <InvoiceEditForm invoice={inv} />}
      {isInvoice && inv.status === 'paid' && (
        <Alert tone="info">
          A paid invoice cannot be changed. To correct it, issue a credit note below (it can pay the amount back to the customer's card).
        </Alert>
      )}
      {isInvoice && (
        <Card>
          <CardTitle>Credit notes</CardTitle>
          {inv.creditNotes.length > 0 && (
            <ul className="mb-4 flex flex-col gap-1 text-sm">
              {inv.creditNotes.map((c) => (
                <li key={c.id}>
                  <Link className="font-mono text-teal-dark hover:underline" to={`/invoices/${c.id}`}>
                    {c.number}
                  </Link>{' '}
                  · {formatDate(c.issueDate)} · {formatMoney(c.grossMinor, c.currency)}
                </li>
              ))}
            </ul>
          )}
          <CreditNoteForm invoice={inv} />
        </Card>
      )}
    </div>
  );
}

function SendButton({ invoice }: { invoice: Invoice }) {
  const send = useSendInvoice(invoice.id);
  return (
    <span className="flex items-center gap-2">
      <Button variant="primary" busy={send.isPending} onClick={() => send.mutate()} disabled={!invoice.customerEmail}>
        {invoice.sentAt ? 'Send again' : 'Send to customer'}
      </Button>
      {send.isError && (
        <span role="alert" className="text-sm text-brick-dark">
          {asSentence(send.error.message)}
        </span>
      )}
      {send.isSuccess && <span className="text-sm text-teal-dark">Sent.</span>}
    </span>
  );
}

function Summary({ inv }: { inv: Invoice }) {
  const m = (v: number) => formatMoney(v, inv.currency);
  const rows: Array<[string, string]> = [
    ['Issued', formatDate(inv.issueDate)],
    ...(inv.dueDate ? ([['Due', `${formatDate(inv.dueDate)}${inv.overdue ? ' — overdue' : ''}`]] as Array<[string, string]>) : []),
    ['Total', m(inv.grossMinor)],
    ...(inv.depositMinor ? ([['Deposit paid', `−${m(inv.depositMinor)}`]] as Array<[string, string]>) : []),
    ...(inv.creditedMinor ? ([['Credited', `−${m(inv.creditedMinor)}`]] as Array<[string, string]>) : []),
    ...(inv.kind === 'invoice'
      ? ([[inv.status === 'paid' ? 'Paid' : 'To pay', inv.status === 'paid' ? formatDateTime(inv.paidAt) : m(inv.balanceMinor)]] as Array<[string, string]>)
      : []),
    ['Sent', inv.sentAt ? formatDateTime(inv.sentAt) : inv.customerEmail ? 'not yet' : 'the customer has no e-mail address'],
  ];
  return (
    <Card>
      <dl className="grid grid-cols-[auto_1fr] gap-x-6 gap-y-1 text-sm sm:grid-cols-[auto_1fr_auto_1fr]">
        {rows.map(([k, v]) => (
          <div key={k} className="contents">
            <dt className="text-graphite-light">{k}</dt>
            <dd className="font-mono" data-testid={`summary-${k.toLowerCase().replace(/\s+/g, '-')}`}>
              {v}
            </dd>
          </div>
        ))}
      </dl>
      {inv.payUrl && inv.balanceMinor > 0 && (
        <p className="mt-3 break-all text-xs text-graphite-light">
          Customer's private pay link:{' '}
          <a className="font-mono text-teal-dark" href={inv.payUrl} target="_blank" rel="noreferrer">
            {inv.payUrl}
          </a>
        </p>
      )}
    </Card>
  );
}

function Lines({ inv }: { inv: Invoice }) {
  const m = (v: number) => formatMoney(v, inv.currency);
  return (
    <Table>
      <THead>
        <Tr>
          <Th>Description</Th>
          <Th className="text-right">Qty</Th>
          <Th className="text-right">Unit</Th>
          <Th className="text-right">VAT</Th>
          <Th className="text-right">Net</Th>
          <Th className="text-right">Total</Th>
        </Tr>
      </THead>
      <TBody>
        {inv.lines.map((l) => (
          <Tr key={l.id}>
            <Td>
              {l.description}
              {l.source === 'variation' && <span className="ml-2 rounded bg-straw-light px-1.5 py-0.5 text-xs">variation</span>}
            </Td>
            <Td className="text-right font-mono">
              {l.quantity.toLocaleString('en-GB', { maximumFractionDigits: 3 })} {l.unit}
            </Td>
            <Td className="text-right font-mono">{m(l.unitPriceMinor)}</Td>
            <Td className="text-right font-mono">{formatRateBp(l.rateBp)}</Td>
            <Td className="text-right font-mono">{m(l.netMinor)}</Td>
            <Td className="text-right font-mono">{m(l.grossMinor)}</Td>
          </Tr>
        ))}
        <Tr>
          <Td colSpan={4} className="text-right text-graphite-light">
            Net
          </Td>
          <Td colSpan={2} className="text-right font-mono">
            {m(inv.netMinor)}
          </Td>
        </Tr>
        {inv.taxByRate.map((t) => (
          <Tr key={t.rateBp}>
            <Td colSpan={4} className="text-right text-graphite-light">
              VAT at {formatRateBp(t.rateBp)} on {m(t.netMinor)}
            </Td>
            <Td colSpan={2} className="text-right font-mono">
              {m(t.taxMinor)}
            </Td>
          </Tr>
        ))}
        <Tr>
          <Td colSpan={4} className="text-right font-semibold">
            Total
          </Td>
          <Td colSpan={2} className="text-right font-mono font-semibold">
            {m(inv.grossMinor)}
          </Td>
        </Tr>
      </TBody>
    </Table>
  );
}
