import { useState, type FormEvent } from 'react';
import type { Invoice } from '../../../../shared/api/invoices';
import { minorToDecimalString } from '../../../../shared/quote/money';
import { Alert, Button, Card, CardTitle, Field, Input, Textarea } from '../../../components/ui';
import { asSentence } from '../../../lib/form-errors';
import { useUpdateInvoice } from '../api/update-invoice';
import { LineEditor, toLineInputs, type DraftLine } from './line-editor';

/** Change an unpaid invoice: the variations found on site, the due date and the notes. */
export function InvoiceEditForm({ invoice }: { invoice: Invoice }) {
  const update = useUpdateInvoice(invoice.id);
  const [dueDate, setDueDate] = useState(invoice.dueDate ?? '');
  const [notes, setNotes] = useState(invoice.notes);
  const [lines, setLines] = useState<DraftLine[]>(() =>
    invoice.lines
      .filter((l) => l.source === 'variation')
      .map((l) => ({
        description: l.description,
        quantity: String(l.quantity),
        price: minorToDecimalString(l.unitPriceMinor, invoice.currency),
        taxClass: (l.taxClass ?? 'standard') as DraftLine['taxClass'],
      })),
  );
  const [problem, setProblem] = useState<string | null>(null);

  function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = toLineInputs(lines, invoice.currency);
    if ('error' in parsed) return setProblem(parsed.error);
    setProblem(null);
    update.mutate({ variations: parsed.lines, notes, ...(dueDate ? { dueDate } : {}) });
  }

  return (
    <Card>
      <CardTitle>Change this invoice</CardTitle>
      <form onSubmit={submit} className="flex flex-col gap-4">
        <LineEditor label="Variations found on site (added to the quote's lines)" lines={lines} onChange={setLines} />
        <div className="grid gap-3 sm:grid-cols-[12rem_1fr]">
          <Field label="Due date">
            <Input type="date" value={dueDate} min={invoice.issueDate} onChange={(e) => setDueDate(e.target.value)} />
          </Field>
          <Field label="Notes printed on the invoice">
            <Textarea rows={2} value={notes} onChange={(e) => setNotes(e.target.value)} />
          </Field>
        </div>
        {(problem || update.isError) && <Alert>{asSentence(problem ?? update.error?.message ?? '')}</Alert>}
        {update.isSuccess && <Alert tone="success">Saved. Send it again so the customer has the new version.</Alert>}
        <div>
          <Button type="submit" busy={update.isPending}>
            Save changes
          </Button>
        </div>
      </form>
    </Card>
  );
}
