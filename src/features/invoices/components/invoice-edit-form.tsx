import { FormProvider } from 'react-hook-form';
import { z } from 'zod';
import { invoicePatchSchema, type Invoice } from '../../../../shared/api/invoices';
import type { TaxClass } from '../../../../shared/api/settings';
import { formatMoneyInput } from '../../../../shared/quote/money-input';
import { Alert, Button, Card, CardTitle, Input, Textarea } from '../../../components/ui';
import { FormField, setErrorOnSentRows, showServerErrors, useZodForm } from '../../../lib/forms';
import { asSentence } from '../../../lib/form-errors';
import { useUpdateInvoice } from '../api/update-invoice';
import { LineEditor } from './line-editor';
import { keptRows, linesFormSchema } from './line-form-schema';

/** The API's invoice patch with the variations typed; a due date left blank is not sent. */
const invoiceEditSchema = (currency: string) =>
  invoicePatchSchema.extend({
    variations: linesFormSchema(currency),
    dueDate: z
      .string()
      .transform((v) => v || undefined)
      .pipe(invoicePatchSchema.shape.dueDate),
  });

/** Change an unpaid invoice: the variations found on site, the due date and the notes. */
export function InvoiceEditForm({ invoice }: { invoice: Invoice }) {
  const update = useUpdateInvoice(invoice.id);
  const form = useZodForm(invoiceEditSchema(invoice.currency), {
    defaultValues: {
      dueDate: invoice.dueDate ?? '',
      notes: invoice.notes,
      variations: invoice.lines
        .filter((l) => l.source === 'variation')
        .map((l) => ({
          description: l.description,
          quantity: String(l.quantity),
          unitPriceMinor: formatMoneyInput(l.unitPriceMinor, invoice.currency),
          taxClass: (l.taxClass ?? 'standard') as TaxClass,
        })),
    },
  });

  const onSubmit = form.handleSubmit(async (body) => {
    // The rows as sent: one added or emptied while the request is out must not shift its messages.
    const onRow = setErrorOnSentRows(form.setError, 'variations', keptRows(form.getValues('variations')));
    try {
      await update.mutateAsync(body);
    } catch (err) {
      showServerErrors(err, onRow);
    }
  });
  const problem = form.formState.errors.root?.server?.message;

  return (
    <Card>
      <CardTitle>Change this invoice</CardTitle>
      <FormProvider {...form}>
        <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
          <LineEditor name="variations" label="Variations found on site (added to the quote's lines)" />
          <div className="grid gap-3 sm:grid-cols-[12rem_1fr]">
            <FormField name="dueDate" label="Due date">
              <Input type="date" min={invoice.issueDate} {...form.register('dueDate')} />
            </FormField>
            <FormField name="notes" label="Notes printed on the invoice">
              <Textarea rows={2} {...form.register('notes')} />
            </FormField>
          </div>
          {problem && <Alert>{asSentence(problem)}</Alert>}
          {update.isSuccess && <Alert tone="success">Saved. Send it again so the customer has the new version.</Alert>}
          <div>
            <Button type="submit" busy={update.isPending}>
              Save changes
            </Button>
          </div>
        </form>
      </FormProvider>
    </Card>
  );
}
