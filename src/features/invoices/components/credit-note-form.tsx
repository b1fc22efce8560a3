import { FormProvider } from 'react-hook-form';
import type { z } from 'zod';
import { useNavigate } from 'react-router-dom';
import { creditNoteCreateSchema, type Invoice, type InvoiceLine } from '../../../../shared/api/invoices';
import type { TaxClass } from '../../../../shared/api/settings';
import { formatMoneyInput } from '../../../../shared/quote/money-input';
import { Alert, Button, Field, Input, Select } from '../../../components/ui';
import { FormField, setErrorOnSentRows, showServerErrors, useZodForm } from '../../../lib/forms';
import { asSentence } from '../../../lib/form-errors';
import { useCreateCreditNote } from '../api/update-invoice';
import { LineEditor } from './line-editor';
import { emptyLine, isBlankLine, keptRows, linesFormSchema, type LineValues } from './line-form-schema';

/** A credit line copied from an invoice line, with that line's tax class (a zero-rated line is credited at zero). */
export function creditLineFrom(line: InvoiceLine, currency: string): LineValues {
  return {
    description: `Credit: ${line.description}`,
    quantity: String(line.quantity),
    unitPriceMinor: formatMoneyInput(line.unitPriceMinor, currency),
    taxClass: (line.taxClass ?? 'standard') as TaxClass,
  };
}

/** The API's credit note body, its lines typed (linesFormSchema); at least one line left once blank rows are dropped. */
export const creditNoteFormSchema = (currency: string) =>
  creditNoteCreateSchema.extend({
    lines: linesFormSchema(currency).pipe(
      creditNoteCreateSchema.shape.lines as unknown as z.ZodType<z.output<typeof creditNoteCreateSchema.shape.lines>, LineOut[]>,
    ),
  });
type LineOut = z.output<ReturnType<typeof linesFormSchema>>[number];

/** Issue a credit note against an invoice; for a paid one, optionally refund it to the card. */
export function CreditNoteForm({ invoice }: { invoice: Invoice }) {
  const create = useCreateCreditNote(invoice.id);
  const navigate = useNavigate();
  const form = useZodForm(creditNoteFormSchema(invoice.currency), { defaultValues: { reason: '', lines: [emptyLine()], refund: false } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (body) => {
    // The rows as sent: one added or emptied while the request is out must not shift its messages.
    const onRow = setErrorOnSentRows(form.setError, 'lines', keptRows(form.getValues('lines')));
    let id: string;
    try {
      id = (await create.mutateAsync({ ...body, refund: invoice.status === 'paid' && body.refund })).id;
    } catch (err) {
      showServerErrors(err, onRow);
      return;
    }
    navigate(`/invoices/${id}`);
  });

  // "add at least one line" is about the list, not one row's field.
  const problem = errors.lines?.message ?? errors.lines?.root?.message ?? errors.root?.server?.message;
  return (
    <FormProvider {...form}>
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-3">
        <FormField name="reason" label="Reason (printed on the credit note)" required>
          <Input placeholder="e.g. walkway boards not fitted" {...form.register('reason')} />
        </FormField>
        {invoice.lines.length > 0 && (
          <Field label="Credit a line of the invoice (copies its price and tax class)">
            <Select
              value=""
              onChange={(e) => {
                const line = invoice.lines.find((l) => l.id === e.target.value);
                if (!line) return;
                const kept = form.getValues('lines').filter((l) => !isBlankLine(l));
                form.setValue('lines', [...kept, creditLineFrom(line, invoice.currency)]);
              }}
            >
              <option value="">Choose a line…</option>
              {invoice.lines.map((l) => (
                <option key={l.id} value={l.id}>
                  {l.description} ({l.quantity} {l.unit})
                </option>
              ))}
            </Select>
          </Field>
        )}
        <LineEditor name="lines" label="What is credited" />
        {invoice.status === 'paid' && (
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" {...form.register('refund')} /> Pay it back to the customer's card
          </label>
        )}
        {problem && <Alert>{asSentence(problem)}</Alert>}
        <div>
          <Button type="submit" variant="secondary" busy={create.isPending}>
            Issue credit note
          </Button>
        </div>
      </form>
    </FormProvider>
  );
}
