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
  type Updater,
} from '@tanstack/react-table';
import { useState, type ReactNode } from 'react';
import { Button, Table, TBody, Td, Th, THead, Tr } from '../ui';
import { ServerPager, type ServerPages } from './server-pager';

declare module '@tanstack/react-table' {
  // Per-column classes (alignment, hidden on phones) and the text the filter searches, read by
  // DataTable. An augmentation repeats the library's type parameters, used or not.
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData extends RowData, TValue> {
    className?: string;
    /** What the filter matches for this column when its value is not the text people see (money in minor units, flags). */
    searchText?: (row: TData) => string;
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
      const text = c.column.columnDef.meta?.searchText;
      if (text) return text(row.original);
      const v = c.getValue();
      return typeof v === 'string' || typeof v === 'number' ? String(v) : '';
    })
    .join(' ')
    .toLowerCase();
  return words.every((w) => hay.includes(w));
};

/** The order held outside the table (the server sorts): one column at a time, never unsorted. */
export type ControlledSort = { sorting: SortingState; onSortingChange: (next: SortingState) => void };

type DataTableProps<T> = {
  label: string;
  data: T[];
  columns: ColumnDef<T, never>[];
  rowId: (row: T) => string;
  /** Text to filter the loaded rows by (the page owns the search box); matched by every word. */
  filter?: string;
  initialSort?: SortingState;
  /** Where the server sorts: the headers show and change this order instead of sorting the rows. */
  sort?: ControlledSort;
  /** Rows per page when the table pages itself (the whole list is loaded). */
  pageSize?: number;
  /** Where the server pages: the rows are every page loaded so far and the table offers the next. */
  serverPages?: ServerPages;
  /** Shown instead of the table when the filter leaves no row. */
  noMatch?: ReactNode;
  rowClassName?: (row: T) => string | undefined;
};

/**
 * The app's data tables on TanStack Table: sortable headers (a button, the header's aria-sort
 * says the order), the page's search applied as a filter, and paging — on the client where the
 * whole list is loaded (`pageSize`), or the server's pages one after another (`serverPages`, with
 * `sort` when the server orders the rows too).
 */
export function DataTable<T>(props: DataTableProps<T>) {
  const { label, data, columns, rowId, filter, initialSort = [], sort, pageSize, serverPages, noMatch, rowClassName } = props;
  const [ownSorting, setOwnSorting] = useState<SortingState>(initialSort);
  const sorting = sort ? sort.sorting : ownSorting;
  const onSortingChange = (u: Updater<SortingState>) => {
    const next = typeof u === 'function' ? u(sorting) : u;
    if (sort) sort.onSortingChange(next);
    else setOwnSorting(next);
  };
  // The table object is rebuilt on every render by design, so the compiler leaves this component unmemoised.
  // eslint-disable-next-line react-hooks/incompatible-library
  const table = useReactTable({
    data,
    columns,
    getRowId: rowId,
    state: { sorting, globalFilter: filter ?? '' },
    onSortingChange,
    manualSorting: !!sort,
    enableSortingRemoval: !sort,
    enableMultiSort: !sort,
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
                        className="inline-flex items-center gap-1 rounded-sm text-left whitespace-normal uppercase hover:text-graphite focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-teal"
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
            <Tr key={r.id} className={rowClassName?.(r.original)}>
              {r.getVisibleCells().map((c) => (
                <Td key={c.id} className={c.column.columnDef.meta?.className}>
                  {flexRender(c.column.columnDef.cell, c.getContext())}
                </Td>
              ))}
            </Tr>
          ))}
        </TBody>
      </Table>
      {serverPages && <ServerPager label={label} pages={serverPages} />}
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
