import { useState } from 'react';
import type { InvoiceListQuery } from '../../../../shared/api/invoices';
import { ButtonLink, EmptyState, ErrorState, LoadingState, PageHeader, Tabs } from '../../../components/ui';
import { useInvoices } from '../api/get-invoices';
import { InvoicesTable } from './invoices-table';

type Filter = NonNullable<InvoiceListQuery['status']> | 'all';
const FILTERS: Array<{ value: Filter; label: string }> = [
  { value: 'all', label: 'All' },
  { value: 'issued', label: 'To pay' },
  { value: 'overdue', label: 'Overdue' },
  { value: 'paid', label: 'Paid' },
];

/** Office: every invoice and credit note, filtered by what is still to pay. */
export default function InvoicesPage() {
  const [filter, setFilter] = useState<Filter>('all');
  const invoices = useInvoices(filter === 'all' ? {} : { status: filter });
  return (
    <div>
      <PageHeader
        title="Invoices"
        subtitle="Invoices are made from a job once it is installed: open the job and choose “Create invoice”."
        actions={<ButtonLink to="/settings/payments">Deposit and payment terms</ButtonLink>}
      />
      <Tabs label="Show" look="pill" value={filter} onValueChange={setFilter} tabs={FILTERS} panelClassName="mt-3">
        {invoices.isPending ? (
          <LoadingState label="Loading invoices…" />
        ) : invoices.isError ? (
          <ErrorState error={invoices.error} onRetry={() => invoices.refetch()} title="The invoices could not be loaded" />
        ) : invoices.data.length === 0 ? (
          <EmptyState title={filter === 'all' ? 'No invoices yet' : 'Nothing here'}>Invoices appear here once an installed job is invoiced.</EmptyState>
        ) : (
          <InvoicesTable invoices={invoices.data} />
        )}
      </Tabs>
    </div>
  );
}
