import { createColumnHelper } from '@tanstack/react-table';
import type { ReactNode } from 'react';
import type { Customer } from '../../../../shared/api/customers';
import { DataTable } from '../../../components/data-table/data-table';
import { Button, formatAddress } from '../../../components/ui';

const col = createColumnHelper<Customer>();

/** The company's customers, sortable, filtered by the page's search; rows offer an edit button when the user may change them. */
export function CustomersTable({
  customers,
  filter,
  noMatch,
  onEdit,
}: {
  customers: Customer[];
  filter?: string;
  noMatch?: ReactNode;
  onEdit?: (c: Customer) => void;
}) {
  const columns = [
    col.accessor('name', {
      header: 'Name',
      meta: { className: 'font-medium' },
      cell: (c) => (
        <>
          {c.getValue()}
          <div className="mt-0.5 text-xs font-normal text-graphite-light sm:hidden">{c.row.original.phone || c.row.original.email}</div>
        </>
      ),
    }),
    col.accessor((c) => [c.email, c.phone].filter(Boolean).join(' '), {
      id: 'contact',
      header: 'Contact',
      enableSorting: false,
      meta: { className: 'hidden text-graphite-light sm:table-cell' },
      cell: (c) => (
        <>
          <div>{c.row.original.email}</div>
          <div>{c.row.original.phone}</div>
        </>
      ),
    }),
    col.accessor((c) => formatAddress(c.address), { id: 'address', header: 'Address', meta: { className: 'text-graphite-light' } }),
    ...(onEdit
      ? [
          col.display({
            id: 'actions',
            header: () => <span className="sr-only">Actions</span>,
            meta: { className: 'w-px' },
            cell: (c) => (
              <Button size="sm" variant="ghost" onClick={() => onEdit(c.row.original)} aria-label={`Edit ${c.row.original.name}`}>
                Edit
              </Button>
            ),
          }),
        ]
      : []),
  ];
  return (
    <DataTable
      label="Customers"
      data={customers}
      columns={columns as never}
      rowId={(c) => c.id}
      filter={filter}
      initialSort={[{ id: 'name', desc: false }]}
      pageSize={25}
      noMatch={noMatch}
    />
  );
}
