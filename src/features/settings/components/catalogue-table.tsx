import { useMemo, useState } from 'react';
import type { z } from 'zod';
import { formatMoney } from '../../../../shared/quote/money';
import { formatRateBp } from '../../../../shared/quote/tax';
import { Button, Card, CardTitle, EmptyState, ErrorState, Input, Spinner, Table, TBody, Td, Th, THead, Tr } from '../../../components/ui';
import { useCatalogue, useCatalogueMutation, type CatalogueResource } from '../api/catalogue';
import { CatalogueRowForm } from './catalogue-row-form';

export type ColumnType = 'text' | 'number' | 'money' | 'bool' | 'select' | 'date' | 'rate' | 'roles';
export interface ColumnDef {
  key: string;
  label: string;
  type: ColumnType;
  options?: Array<{ value: string; label: string }>;
  /** Shown in the table; all columns are in the form. */
  inTable?: boolean;
  step?: string;
}

type Row = Record<string, unknown> & { id: string };

function display(c: ColumnDef, v: unknown, currency: string): string {
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

type Props = { resource: CatalogueResource; title: string; columns: ColumnDef[]; schema: z.ZodObject; currency: string; blank: Record<string, unknown> };

/**
 * A catalogue table: sort by any column (click its header), filter by text, add, edit and delete
 * rows through one form checked with the same zod schema as the server.
 */
export function CatalogueTable({ resource, title, columns, schema, currency, blank }: Props) {
  const list = useCatalogue<Row>(resource);
  const { save, remove } = useCatalogueMutation(resource);
  const [sort, setSort] = useState<{ key: string; dir: 1 | -1 }>({ key: columns[0].key, dir: 1 });
  const [filter, setFilter] = useState('');
  // The row being added or edited; `n` gives each opening a fresh form.
  const [editing, setEditing] = useState<{ id?: string; row: Row; n: number } | null>(null);

  const rows = useMemo(() => {
    const f = filter.trim().toLowerCase();
    const data = (list.data ?? []).filter((r) => !f || columns.some((c) => display(c, r[c.key], currency).toLowerCase().includes(f)));
    return [...data].sort((a, b) => {
      const x = a[sort.key],
        y = b[sort.key];
      const cmp = typeof x === 'number' && typeof y === 'number' ? x - y : String(x ?? '').localeCompare(String(y ?? ''));
      return cmp * sort.dir;
    });
  }, [list.data, filter, sort, columns, currency]);

  const open = (row?: Row) => setEditing((e) => ({ id: row?.id, row: row ?? (blank as Row), n: (e?.n ?? 0) + 1 }));
  const visible = columns.filter((c) => c.inTable !== false);

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
      <div className="mb-3 max-w-xs">
        <Input placeholder="Filter…" aria-label={`Filter ${title}`} value={filter} onChange={(e) => setFilter(e.target.value)} />
      </div>
      {list.isPending && <Spinner />}
      {list.isError && <ErrorState error={list.error} onRetry={() => list.refetch()} />}
      {list.data && rows.length === 0 && <EmptyState title={filter ? 'Nothing matches the filter' : 'Nothing here yet'} />}
      {rows.length > 0 && (
        <Table aria-label={title}>
          <THead>
            <Tr>
              {visible.map((c) => (
                <Th key={c.key} aria-sort={sort.key === c.key ? (sort.dir === 1 ? 'ascending' : 'descending') : 'none'}>
                  <button
                    type="button"
                    className="uppercase"
                    onClick={() => setSort((s) => ({ key: c.key, dir: s.key === c.key ? (s.dir === 1 ? -1 : 1) : 1 }))}
                  >
                    {c.label} {sort.key === c.key ? (sort.dir === 1 ? '▲' : '▼') : ''}
                  </button>
                </Th>
              ))}
              <Th>
                <span className="sr-only">Actions</span>
              </Th>
            </Tr>
          </THead>
          <TBody>
            {rows.map((r) => (
              <Tr key={r.id}>
                {visible.map((c) => (
                  <Td key={c.key} className={c.type === 'money' || c.type === 'number' || c.type === 'rate' ? 'text-right font-mono' : ''}>
                    {display(c, r[c.key], currency)}
                  </Td>
                ))}
                <Td className="whitespace-nowrap">
                  <Button size="sm" variant="ghost" onClick={() => open(r)}>
                    Edit
                  </Button>
                  <Button
                    size="sm"
                    variant="danger-ghost"
                    onClick={() => {
                      if (window.confirm('Delete this row?')) remove.mutate(r.id);
                    }}
                  >
                    Delete
                  </Button>
                </Td>
              </Tr>
            ))}
          </TBody>
        </Table>
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
