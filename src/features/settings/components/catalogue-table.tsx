import { useMemo, useState } from 'react';
import type { z } from 'zod';
import { formatMoney, minorToDecimalString } from '../../../../shared/quote/money';
import { parseMoney } from '../../../../shared/quote/money-input';
import { formatRateBp } from '../../../../shared/quote/tax';
import { Alert, Button, Card, CardTitle, EmptyState, ErrorState, Field, Input, Select, Spinner, Table, TBody, Td, Th, THead, Tr } from '../../../components/ui';
import { serverFieldErrors } from '../../../lib/form-errors';
import { useCatalogue, useCatalogueMutation, type CatalogueResource } from '../api/catalogue';

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

function toText(c: ColumnDef, v: unknown, currency: string): string {
  if (v === null || v === undefined) return '';
  if (c.type === 'money') return minorToDecimalString(Number(v), currency);
  if (c.type === 'rate') return String(Number(v) / 100);
  if (c.type === 'roles') return (v as string[]).join(',');
  return String(v);
}

function fromText(c: ColumnDef, text: string, currency: string): unknown {
  switch (c.type) {
    case 'number':
      return text.trim() === '' ? undefined : Number(text);
    case 'money':
      return parseMoney(text, currency) ?? Number.NaN;
    case 'rate':
      return text.trim() === '' ? undefined : Math.round(Number(text) * 100);
    case 'bool':
      return text === 'true';
    case 'roles':
      return text
        .split(',')
        .map((s) => s.trim())
        .filter(Boolean);
    default:
      return text;
  }
}

type Props = { resource: CatalogueResource; title: string; columns: ColumnDef[]; schema: z.ZodType; currency: string; blank: Record<string, unknown> };

/**
 * A catalogue table: sort by any column (click its header), filter by text, add, edit and delete
 * rows through one form checked with the same zod schema as the server.
 */
export function CatalogueTable({ resource, title, columns, schema, currency, blank }: Props) {
  const list = useCatalogue<Row>(resource);
  const { save, remove } = useCatalogueMutation(resource);
  const [sort, setSort] = useState<{ key: string; dir: 1 | -1 }>({ key: columns[0].key, dir: 1 });
  const [filter, setFilter] = useState('');
  const [editing, setEditing] = useState<{ id?: string; values: Record<string, string> } | null>(null);
  const [errors, setErrors] = useState<Record<string, string>>({});

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

  const open = (row?: Row) => {
    const src = row ?? (blank as Row);
    setErrors({});
    setEditing({ id: row?.id, values: Object.fromEntries(columns.map((c) => [c.key, toText(c, src[c.key], currency)])) });
  };
  const submit = async () => {
    if (!editing) return;
    const body = Object.fromEntries(columns.map((c) => [c.key, fromText(c, editing.values[c.key] ?? '', currency)]));
    const parsed = schema.safeParse(body);
    if (!parsed.success) {
      setErrors(Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0] ?? ''), i.message])));
      return;
    }
    try {
      await save.mutateAsync({ id: editing.id, body: parsed.data });
      setEditing(null);
    } catch (e) {
      setErrors(serverFieldErrors(e));
    }
  };
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
        <form
          className="mt-4 grid grid-cols-1 gap-3 rounded-lg border border-paper-line bg-paper/60 p-4 sm:grid-cols-3"
          onSubmit={(e) => {
            e.preventDefault();
            void submit();
          }}
        >
          {columns.map((c) => (
            <Field key={c.key} label={c.label} error={errors[c.key]}>
              {c.type === 'select' || c.type === 'bool' ? (
                <Select value={editing.values[c.key]} onChange={(e) => setEditing({ ...editing, values: { ...editing.values, [c.key]: e.target.value } })}>
                  {(c.type === 'bool'
                    ? [
                        { value: 'true', label: 'yes' },
                        { value: 'false', label: 'no' },
                      ]
                    : (c.options ?? [])
                  ).map((o) => (
                    <option key={o.value} value={o.value}>
                      {o.label}
                    </option>
                  ))}
                </Select>
              ) : (
                <Input
                  type={c.type === 'date' ? 'date' : 'text'}
                  inputMode={c.type === 'text' || c.type === 'date' || c.type === 'roles' ? undefined : 'decimal'}
                  value={editing.values[c.key]}
                  onChange={(e) => setEditing({ ...editing, values: { ...editing.values, [c.key]: e.target.value } })}
                />
              )}
            </Field>
          ))}
          <div className="flex gap-2 sm:col-span-3">
            <Button type="submit" busy={save.isPending}>
              {editing.id ? 'Save' : 'Add'}
            </Button>
            <Button variant="ghost" onClick={() => setEditing(null)}>
              Cancel
            </Button>
          </div>
          {save.error && !Object.keys(errors).length && (
            <div className="sm:col-span-3">
              <Alert>{save.error.message}</Alert>
            </div>
          )}
        </form>
      )}
    </Card>
  );
}
