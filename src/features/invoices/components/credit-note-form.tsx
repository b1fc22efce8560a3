import { useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import type { Invoice, InvoiceLine } from '../../../../shared/api/invoices';
import type { TaxClass } from '../../../../shared/api/settings';
import { formatMoneyInput } from '../../../../shared/quote/money-input';
import { Alert, Button, Field, Input, Select } from '../../../components/ui';
import { asSentence } from '../../../lib/form-errors';
import { useCreateCreditNote } from '../api/update-invoice';
import { emptyLine, LineEditor, toLineInputs, type DraftLine } from './line-editor';

/** A credit line copied from an invoice line, with that line's tax class (a zero-rated line is credited at zero). */
export function creditLineFrom(line: InvoiceLine, currency: string): DraftLine {
  return {
    description: `Credit: ${line.description}`,
    quantity: String(line.quantity),
    price: formatMoneyInput(line.unitPriceMinor, currency),
    taxClass: (line.taxClass ?? 'standard') as TaxClass,
  };
}

/** Issue a credit note against an invoice; for a paid one, optionally refund it to the card. */
export function CreditNoteForm({ invoice }: { invoice: Invoice }) {
  const create = useCreateCreditNote(invoice.id);
  const navigate = useNavigate();
  const [reason, setReason] = useState('');
  const [lines, setLines] = useState<DraftLine[]>([emptyLine()]);
  const [refund, setRefund] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  function submit(e: FormEvent) {
    e.preventDefault();
    const parsed = toLineInputs(lines, invoice.currency);
    if ('error' in parsed) return setProblem(parsed.error);
    if (parsed.lines.length === 0) return setProblem('add at least one line');
    if (!reason.trim()) return setProblem('say why the credit is given');
    setProblem(null);
    create.mutateAsync({ reason, lines: parsed.lines, refund: invoice.status === 'paid' && refund }).then(
      (cn) => navigate(`/invoices/${cn.id}`),
      () => undefined,
    );
  }

  return (
    <form onSubmit={submit} className="flex flex-col gap-3">
      <Field label="Reason (printed on the credit note)" required>
        <Input value={reason} onChange={(e) => setReason(e.target.value)} placeholder="e.g. walkway boards not fitted" />
      </Field>
      {invoice.lines.length > 0 && (
        <Field label="Credit a line of the invoice (copies its price and tax class)">
          <Select
            value=""
            onChange={(e) => {
              const line = invoice.lines.find((l) => l.id === e.target.value);
              if (!line) return;
              const kept = lines.filter((l) => l.description.trim() || l.price.trim());
              setLines([...kept, creditLineFrom(line, invoice.currency)]);
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
      <LineEditor label="What is credited" lines={lines} onChange={setLines} />
      {invoice.status === 'paid' && (
        <label className="flex items-center gap-2 text-sm">
          <input type="checkbox" checked={refund} onChange={(e) => setRefund(e.target.checked)} /> Pay it back to the customer's card
        </label>
      )}
      {(problem || create.isError) && <Alert>{asSentence(problem ?? create.error?.message ?? '')}</Alert>}
      <div>
        <Button type="submit" variant="secondary" busy={create.isPending}>
          Issue credit note
        </Button>
      </div>
    </form>
  );
}
