import { createColumnHelper } from '@tanstack/react-table';
import { Link } from 'react-router-dom';
import type { InvoiceSummary } from '../../../../shared/api/invoices';
import { formatMoney } from '../../../../shared/quote/money';
import { DataTable } from '../../../components/data-table/data-table';
import { formatDate } from '../../../components/ui';
import { InvoiceStatusBadge } from './invoice-status-badge';

const col = createColumnHelper<InvoiceSummary>();

// Dates sort as ISO text; amounts by their minor units (a credit note counts as negative).
const columns = [
  col.accessor('number', {
    header: 'Number',
    meta: { className: 'font-mono' },
    cell: (c) => (
      <Link className="text-teal-dark underline-offset-2 hover:underline" to={`/invoices/${c.row.original.id}`}>
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor('jobReference', {
    header: 'Job',
    meta: { className: 'font-mono text-xs' },
    cell: (c) => (
      <Link className="hover:underline" to={`/jobs/${c.row.original.jobId}`}>
        {c.getValue()}
      </Link>
    ),
  }),
  col.accessor('customerName', { header: 'Customer' }),
  col.accessor('issueDate', { header: 'Issued', cell: (c) => formatDate(c.getValue()) }),
  col.accessor('dueDate', { header: 'Due', cell: (c) => formatDate(c.getValue()) }),
  col.accessor((i) => (i.kind === 'credit_note' ? -i.grossMinor : i.grossMinor), {
    id: 'total',
    header: 'Total',
    meta: { className: 'text-right font-mono' },
    cell: (c) => `${c.row.original.kind === 'credit_note' ? '−' : ''}${formatMoney(c.row.original.grossMinor, c.row.original.currency)}`,
  }),
  col.accessor((i) => (i.kind === 'invoice' ? i.balanceMinor : 0), {
    id: 'balance',
    header: 'To pay',
    meta: { className: 'text-right font-mono' },
    cell: (c) => (c.row.original.kind === 'invoice' ? formatMoney(c.row.original.balanceMinor, c.row.original.currency) : ''),
  }),
  col.display({ id: 'status', header: 'Status', cell: (c) => <InvoiceStatusBadge invoice={c.row.original} /> }),
];

/** Invoices and credit notes, sortable by any column, newest first as the server sends them. */
export function InvoicesTable({ invoices }: { invoices: InvoiceSummary[] }) {
  return <DataTable label="Invoices" data={invoices} columns={columns as never} rowId={(i) => i.id} pageSize={25} />;
}
