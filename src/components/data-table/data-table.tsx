import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getPaginationRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type FilterFn,
  type RowData,
  type SortingState,
} from '@tanstack/react-table';
import { useState, type ReactNode } from 'react';
import { Button, Table, TBody, Td, Th, THead, Tr } from '../ui';

declare module '@tanstack/react-table' {
  // Per-column classes (alignment, hidden on phones), read by DataTable. An augmentation repeats
  // the library's type parameters, used or not.
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData extends RowData, TValue> {
    className?: string;
  }
}

/** Every word of the filter appears somewhere in the row's searchable text (case-insensitive). */
export const everyWordFilter: FilterFn<unknown> = (row, _columnId, value: string) => {
  const words = String(value ?? '')
    .toLowerCase()
    .split(/\s+/)
    .filter(Boolean);
  if (words.length === 0) return true;
  const hay = row
    .getAllCells()
    .map((c) => {
      const v = c.getValue();
      return typeof v === 'string' || typeof v === 'number' ? String(v) : '';
    })
    .join(' ')
    .toLowerCase();
  return words.every((w) => hay.includes(w));
};

type DataTableProps<T> = {
  label: string;
  data: T[];
  columns: ColumnDef<T, never>[];
  rowId: (row: T) => string;
  /** Text to filter by (the page owns the search box); matched by every word. */
  filter?: string;
  initialSort?: SortingState;
  /** Rows per page when the table pages itself; leave out where the API pages (or to show all). */
  pageSize?: number;
  /** Shown instead of the table when the filter leaves no row. */
  noMatch?: ReactNode;
};

/**
 * The app's data tables on TanStack Table: sortable headers (a button with aria-sort), the page's
 * search applied as a filter, and paging on the client where the whole list is loaded. Where the
 * server pages (the jobs list) the page keeps its own "Load more" and passes no pageSize.
 */
export function DataTable<T>({ label, data, columns, rowId, filter, initialSort = [], pageSize, noMatch }: DataTableProps<T>) {
  const [sorting, setSorting] = useState<SortingState>(initialSort);
  // The table object is rebuilt on every render by design, so the compiler leaves this component unmemoised.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data,
    columns,
    getRowId: rowId,
    state: { sorting, globalFilter: filter ?? '' },
    onSortingChange: setSorting,
    globalFilterFn: everyWordFilter as FilterFn<T>,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    ...(pageSize ? { getPaginationRowModel: getPaginationRowModel(), initialState: { pagination: { pageIndex: 0, pageSize } } } : {}),
    autoResetPageIndex: true,
  });
  const rows = table.getRowModel().rows;
  if (rows.length === 0 && noMatch) return <>{noMatch}</>;
  return (
    <>
      <Table aria-label={label}>
        <THead>
          {table.getHeaderGroups().map((g) => (
            <tr key={g.id}>
              {g.headers.map((h) => {
                const sorted = h.column.getIsSorted();
                const title = flexRender(h.column.columnDef.header, h.getContext());
                return (
                  <Th
                    key={h.id}
                    className={h.column.columnDef.meta?.className}
                    aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : h.column.getCanSort() ? 'none' : undefined}
                  >
                    {h.column.getCanSort() ? (
                      <button
                        type="button"
                        className="inline-flex items-center gap-1 uppercase hover:text-graphite"
                        onClick={h.column.getToggleSortingHandler()}
                      >
                        {title}
                        <span aria-hidden>{sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}</span>
                      </button>
                    ) : (
                      title
                    )}
                  </Th>
                );
              })}
            </tr>
          ))}
        </THead>
        <TBody>
          {rows.map((r) => (
            <Tr key={r.id}>
              {r.getVisibleCells().map((c) => (
                <Td key={c.id} className={c.column.columnDef.meta?.className}>
                  {flexRender(c.column.columnDef.cell, c.getContext())}
                </Td>
              ))}
            </Tr>
          ))}
        </TBody>
      </Table>
      {pageSize && table.getPageCount() > 1 && (
        <nav aria-label={`${label} pages`} className="mt-3 flex items-center justify-end gap-2 text-sm">
          <Button size="sm" variant="secondary" onClick={() => table.previousPage()} disabled={!table.getCanPreviousPage()}>
            Previous
          </Button>
          <span>
            Page {table.getState().pagination.pageIndex + 1} of {table.getPageCount()}
          </span>
          <Button size="sm" variant="secondary" onClick={() => table.nextPage()} disabled={!table.getCanNextPage()}>
            Next
          </Button>
        </nav>
      )}
    </>
  );
}
