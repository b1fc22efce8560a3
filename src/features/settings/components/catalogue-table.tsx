import { createColumnHelper, type Row as TableRow } from '@tanstack/react-table';
import { useState } from 'react';
import type { z } from 'zod';
import { formatMoney } from '../../../../shared/quote/money';
import { formatRateBp } from '../../../../shared/quote/tax';
import { DataTable } from '../../../components/data-table/data-table';
import { Button, Card, CardTitle, EmptyState, ErrorState, Field, Input, Spinner } from '../../../components/ui';
import { useCatalogue, useCatalogueMutation, type CatalogueResource } from '../api/catalogue';
import { CatalogueRowForm } from './catalogue-row-form';

export type ColumnType = 'text' | 'number' | 'money' | 'bool' | 'select' | 'date' | 'rate' | 'roles';
/** One field of a catalogue row: a column of the table and a field of its form. */
export interface CatalogueColumn {
  key: string;
  label: string;
  type: ColumnType;
  options?: Array<{ value: string; label: string }>;
  /** Shown in the table; all columns are in the form. */
  inTable?: boolean;
  /** Also shown on a phone (below 640 px); the rest from a tablet up, and all in the form. */
  onPhone?: boolean;
  step?: string;
}

type Row = Record<string, unknown> & { id: string };

function display(c: CatalogueColumn, v: unknown, currency: string): string {
  if (v === null || v === undefined) return '';
  switch (c.type) {
    case 'money':
      return formatMoney(Number(v), currency);
    case 'bool':
      return v ? 'yes' : 'no';
    case 'rate':
      return formatRateBp(Number(v));
    case 'select':
      return c.options?.find((o) => o.value === v)?.label ?? String(v);
    case 'roles':
      return (v as string[]).join(', ');
    default:
      return String(v);
  }
}

const col = createColumnHelper<Row>();
const byText = (a: TableRow<Row>, b: TableRow<Row>, id: string) => String(a.getValue(id) ?? '').localeCompare(String(b.getValue(id) ?? ''));

/** The table's columns: numbers sort as numbers, choices by the label shown, text as people read it; the filter matches what is shown. */
function tableColumns(fields: CatalogueColumn[], currency: string, onEdit: (r: Row) => void, onDelete: (r: Row) => void) {
  const name = (r: Row) =>
    String(r.name ?? '') ||
    fields
      .slice(0, 3)
      .map((c) => display(c, r[c.key], currency))
      .join(' ');
  return [
    ...fields
      .filter((c) => c.inTable !== false)
      .map((c) => {
        const numeric = c.type === 'money' || c.type === 'number' || c.type === 'rate';
        return col.accessor((r) => (c.type === 'select' ? display(c, r[c.key], currency) : r[c.key]), {
          id: c.key,
          header: c.label,
          sortingFn: numeric || c.type === 'bool' ? 'basic' : byText,
          sortDescFirst: false,
          meta: {
            className: [numeric ? 'text-right font-mono' : '', c.onPhone ? '' : 'hidden sm:table-cell'].join(' ').trim() || undefined,
            searchText: (r: Row) => display(c, r[c.key], currency),
          },
          cell: (cell) => display(c, cell.row.original[c.key], currency),
        });
      }),
    col.display({
      id: 'actions',
      header: () => <span className="sr-only">Actions</span>,
      meta: { className: 'w-px whitespace-nowrap' },
      cell: (cell) => (
        <div className="flex flex-col items-end 2xl:flex-row">
          <Button size="sm" variant="ghost" aria-label={`Edit ${name(cell.row.original)}`} onClick={() => onEdit(cell.row.original)}>
            Edit
          </Button>
          <Button size="sm" variant="danger-ghost" aria-label={`Delete ${name(cell.row.original)}`} onClick={() => onDelete(cell.row.original)}>
            Delete
          </Button>
        </div>
      ),
    }),
  ];
}

type Props = { resource: CatalogueResource; title: string; columns: CatalogueColumn[]; schema: z.ZodObject; currency: string; blank: Record<string, unknown> };

/**
 * A catalogue table (the whole list is loaded): sort by any column's header, filter the rows by
 * every word typed, add, edit and delete rows through one form checked with the same zod schema
 * as the server.
 */
export function CatalogueTable({ resource, title, columns, schema, currency, blank }: Props) {
  const list = useCatalogue<Row>(resource);
  const { save, remove } = useCatalogueMutation(resource);
  const [filter, setFilter] = useState('');
  // The row being added or edited; `n` gives each opening a fresh form.
  const [editing, setEditing] = useState<{ id?: string; row: Row; n: number } | null>(null);

  const open = (row?: Row) => setEditing((e) => ({ id: row?.id, row: row ?? (blank as Row), n: (e?.n ?? 0) + 1 }));
  const del = (row: Row) => {
    if (window.confirm('Delete this row?')) remove.mutate(row.id);
  };

  return (
    <Card>
      <CardTitle
        action={
          <Button size="sm" onClick={() => open()}>
            Add
          </Button>
        }
      >
        {title}
      </CardTitle>
      {list.isPending && <Spinner />}
      {list.isError && <ErrorState error={list.error} onRetry={() => list.refetch()} />}
      {list.data && list.data.length === 0 && <EmptyState title="Nothing here yet" />}
      {list.data && list.data.length > 0 && (
        <>
          <Field label={`Filter ${title}`} className="mb-3 max-w-xs">
            <Input type="search" value={filter} onChange={(e) => setFilter(e.target.value)} />
          </Field>
          <DataTable
            label={title}
            data={list.data}
            columns={tableColumns(columns, currency, open, del) as never}
            rowId={(r) => r.id}
            filter={filter}
            // By the first column a phone shows too, so the order is one the reader can see.
            initialSort={[{ id: (columns.find((c) => c.onPhone && c.inTable !== false) ?? columns[0]).key, desc: false }]}
            pageSize={25}
            noMatch={<EmptyState title="Nothing matches the filter">Nothing here matches “{filter}”.</EmptyState>}
          />
        </>
      )}
      {editing && (
        <CatalogueRowForm
          key={editing.n}
          columns={columns}
          schema={schema}
          currency={currency}
          row={editing.row}
          editing={!!editing.id}
          busy={save.isPending}
          onSave={async (body) => {
            await save.mutateAsync({ id: editing.id, body });
            setEditing(null);
          }}
          onCancel={() => setEditing(null)}
        />
      )}
    </Card>
  );
}
