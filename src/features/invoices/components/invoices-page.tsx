import { useState } from 'react';
import { Link } from 'react-router-dom';
import type { InvoiceListQuery } from '../../../../shared/api/invoices';
import { formatMoney } from '../../../../shared/quote/money';
import { ButtonLink, EmptyState, ErrorState, LoadingState, PageHeader, Table, TBody, Td, Th, THead, Tr, formatDate } from '../../../components/ui';
import { cn } from '../../../lib/cn';
import { useInvoices } from '../api/get-invoices';
import { InvoiceStatusBadge } from './invoice-status-badge';

const FILTERS: Array<{ key: InvoiceListQuery['status'] | 'all'; label: string }> = [
  { key: 'all', label: 'All' },
  { key: 'issued', label: 'To pay' },
  { key: 'overdue', label: 'Overdue' },
  { key: 'paid', label: 'Paid' },
];

/** Office: every invoice and credit note, filtered by what is still to pay. */
export default function InvoicesPage() {
  const [filter, setFilter] = useState<(typeof FILTERS)[number]['key']>('all');
  const invoices = useInvoices(filter === 'all' ? {} : { status: filter });
  return (
    <div>
      <PageHeader
        title="Invoices"
        subtitle="Invoices are made from a job once it is installed: open the job and choose “Create invoice”."
        actions={<ButtonLink to="/settings/payments">Deposit and payment terms</ButtonLink>}
      />
      <div role="tablist" aria-label="Show" className="mb-3 flex gap-1">
        {FILTERS.map((f) => (
          <button
            key={f.key}
            role="tab"
            aria-selected={filter === f.key}
            onClick={() => setFilter(f.key)}
            className={cn('rounded-md px-3 py-1.5 text-sm', filter === f.key ? 'bg-graphite text-white' : 'text-graphite hover:bg-paper-dark')}
          >
            {f.label}
          </button>
        ))}
      </div>
      {invoices.isPending ? (
        <LoadingState label="Loading invoices…" />
      ) : invoices.isError ? (
        <ErrorState error={invoices.error} onRetry={() => invoices.refetch()} title="The invoices could not be loaded" />
      ) : invoices.data.length === 0 ? (
        <EmptyState title={filter === 'all' ? 'No invoices yet' : 'Nothing here'}>Invoices appear here once an installed job is invoiced.</EmptyState>
      ) : (
        <Table>
          <THead>
            <Tr>
              <Th>Number</Th>
              <Th>Job</Th>
              <Th>Customer</Th>
              <Th>Issued</Th>
              <Th>Due</Th>
              <Th className="text-right">Total</Th>
              <Th className="text-right">To pay</Th>
              <Th>Status</Th>
            </Tr>
          </THead>
          <TBody>
            {invoices.data.map((i) => (
              <Tr key={i.id}>
                <Td className="font-mono">
                  <Link className="text-teal-dark underline-offset-2 hover:underline" to={`/invoices/${i.id}`}>
                    {i.number}
                  </Link>
                </Td>
                <Td className="font-mono text-xs">
                  <Link className="hover:underline" to={`/jobs/${i.jobId}`}>
                    {i.jobReference}
                  </Link>
                </Td>
                <Td>{i.customerName}</Td>
                <Td>{formatDate(i.issueDate)}</Td>
                <Td>{formatDate(i.dueDate)}</Td>
                <Td className="text-right font-mono">
                  {i.kind === 'credit_note' ? '−' : ''}
                  {formatMoney(i.grossMinor, i.currency)}
                </Td>
                <Td className="text-right font-mono">{i.kind === 'invoice' ? formatMoney(i.balanceMinor, i.currency) : ''}</Td>
                <Td>
                  <InvoiceStatusBadge invoice={i} />
                </Td>
              </Tr>
            ))}
          </TBody>
        </Table>
      )}
    </div>
  );
}
