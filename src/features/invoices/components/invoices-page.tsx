import { useState } from 'react';
import type { InvoiceListQuery } from '../../../../shared/api/invoices';
import { ButtonLink, EmptyState, ErrorState, LoadingState, PageHeader } from '../../../components/ui';
import { cn } from '../../../lib/cn';
import { useInvoices } from '../api/get-invoices';
import { InvoicesTable } from './invoices-table';

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
        <InvoicesTable invoices={invoices.data} />
      )}
    </div>
  );
}
