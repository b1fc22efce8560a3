import { FormProvider } from 'react-hook-form';
import { z } from 'zod';
import { formatMoneyInput } from '../../../../shared/quote/money-input';
import { Alert, Button, Input } from '../../../components/ui';
import { booleanText, FormField, FormSelect, moneyText, numberText, percentText, showServerErrors, useZodForm } from '../../../lib/forms';
import type { CatalogueColumn } from './catalogue-table';

type Row = Record<string, unknown>;
type RowValues = Record<string, string>;

/** A row's stored value as the text its field shows. */
function toText(c: CatalogueColumn, v: unknown, currency: string): string {
  if (v === null || v === undefined) return '';
  if (c.type === 'money') return formatMoneyInput(Number(v), currency);
  if (c.type === 'rate') return String(Number(v) / 100);
  if (c.type === 'roles') return (v as string[]).join(',');
  return String(v);
}

/** How one column's text becomes the API's value, then the API's own rule for that field. */
function fieldSchema(c: CatalogueColumn, api: z.ZodType, currency: string): z.ZodType<unknown, string> {
  switch (c.type) {
    case 'number':
      return numberText(api);
    case 'money':
      return moneyText(api, currency);
    case 'rate':
      return percentText(api, 'basis-points');
    case 'bool':
      return booleanText.pipe(api as z.ZodType<unknown, boolean>);
    case 'roles':
      return z
        .string()
        .transform((text) =>
          text
            .split(',')
            .map((s) => s.trim())
            .filter(Boolean),
        )
        .pipe(api as z.ZodType<unknown, string[]>);
    default:
      return api as z.ZodType<unknown, string>;
  }
}

/** The row form's schema: the resource's API schema, field by field, read from the text typed. */
export function catalogueRowSchema(schema: z.ZodObject, columns: CatalogueColumn[], currency: string) {
  return z.object(Object.fromEntries(columns.map((c) => [c.key, fieldSchema(c, schema.shape[c.key] as z.ZodType, currency)])));
}

type Props = {
  columns: CatalogueColumn[];
  schema: z.ZodObject;
  currency: string;
  row: Row;
  editing: boolean;
  busy: boolean;
  onSave: (body: Row) => Promise<unknown>;
  onCancel: () => void;
};

/** Add or edit one catalogue row; every column is a field, checked with the same zod schema as the server. */
export function CatalogueRowForm({ columns, schema, currency, row, editing, busy, onSave, onCancel }: Props) {
  const form = useZodForm(catalogueRowSchema(schema, columns, currency), {
    defaultValues: Object.fromEntries(columns.map((c) => [c.key, toText(c, row[c.key], currency)])) as RowValues,
  });
  const onSubmit = form.handleSubmit(async (body) => {
    try {
      await onSave(body);
    } catch (e) {
      showServerErrors(e, form.setError);
    }
  });
  const formError = form.formState.errors.root?.server?.message;
  return (
    <FormProvider {...form}>
      <form className="mt-4 grid grid-cols-1 gap-3 rounded-lg border border-paper-line bg-paper/60 p-4 sm:grid-cols-3" onSubmit={onSubmit} noValidate>
        {columns.map((c) => (
          <FormField key={c.key} name={c.key} label={c.label}>
            {c.type === 'select' || c.type === 'bool' ? (
              <FormSelect name={c.key}>
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
              </FormSelect>
            ) : (
              <Input
                type={c.type === 'date' ? 'date' : 'text'}
                inputMode={c.type === 'text' || c.type === 'date' || c.type === 'roles' ? undefined : 'decimal'}
                {...form.register(c.key)}
              />
            )}
          </FormField>
        ))}
        <div className="flex gap-2 sm:col-span-3">
          <Button type="submit" busy={busy}>
            {editing ? 'Save' : 'Add'}
          </Button>
          <Button variant="ghost" onClick={onCancel}>
            Cancel
          </Button>
        </div>
        {formError && (
          <div className="sm:col-span-3">
            <Alert>{formError}</Alert>
          </div>
        )}
      </form>
    </FormProvider>
  );
}
