import { TAX_CLASSES, TAX_CLASS_LABELS, type TaxClass } from '../../../../shared/api/settings';
import type { InvoiceLineInput } from '../../../../shared/api/invoices';
import { readMoney } from '../../../../shared/quote/money-input';
import { Button, Input, Select } from '../../../components/ui';

/** A line as typed: the price stays text until it parses, so "12." does not jump while typing. */
export interface DraftLine {
  description: string;
  quantity: string;
  price: string;
  taxClass: TaxClass;
}

export const emptyLine = (): DraftLine => ({ description: '', quantity: '1', price: '', taxClass: 'standard' });

/** Draft lines → API lines, or the first problem in plain words (row numbers from 1). */
export function toLineInputs(lines: DraftLine[], currency: string): { lines: InvoiceLineInput[] } | { error: string } {
  const out: InvoiceLineInput[] = [];
  for (const [i, l] of lines.entries()) {
    if (!l.description.trim() && !l.price.trim()) continue;
    const quantity = Number(l.quantity);
    const price = readMoney(l.price, currency);
    if (!l.description.trim()) return { error: `line ${i + 1}: describe the line` };
    if (!(quantity > 0)) return { error: `line ${i + 1}: the quantity must be above 0` };
    if (!price.ok) return { error: `line ${i + 1}, price: ${price.message}` };
    out.push({ description: l.description.trim(), quantity, unit: 'each', unitPriceMinor: price.minor, taxClass: l.taxClass });
  }
  return { lines: out };
}

/** Rows of description, quantity, unit price and tax class, with add and remove. */
export function LineEditor({ lines, onChange, label }: { lines: DraftLine[]; onChange: (lines: DraftLine[]) => void; label: string }) {
  const set = (i: number, patch: Partial<DraftLine>) => onChange(lines.map((l, j) => (j === i ? { ...l, ...patch } : l)));
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 text-sm font-medium text-graphite">{label}</legend>
      {lines.map((l, i) => (
        <div key={i} className="grid grid-cols-2 items-center gap-2 sm:grid-cols-[minmax(0,1fr)_5rem_7rem_minmax(0,12rem)_auto]">
          <Input
            className="col-span-2 sm:col-span-1"
            aria-label={`Line ${i + 1} description`}
            placeholder="What was done"
            value={l.description}
            onChange={(e) => set(i, { description: e.target.value })}
          />
          <Input aria-label={`Line ${i + 1} quantity`} inputMode="decimal" value={l.quantity} onChange={(e) => set(i, { quantity: e.target.value })} />
          <Input
            aria-label={`Line ${i + 1} unit price`}
            inputMode="decimal"
            placeholder="0.00"
            value={l.price}
            onChange={(e) => set(i, { price: e.target.value })}
          />
          <Select aria-label={`Line ${i + 1} tax class`} value={l.taxClass} onChange={(e) => set(i, { taxClass: e.target.value as TaxClass })}>
            {TAX_CLASSES.map((c) => (
              <option key={c} value={c}>
                {TAX_CLASS_LABELS[c]}
              </option>
            ))}
          </Select>
          <Button variant="danger-ghost" size="sm" aria-label={`Remove line ${i + 1}`} onClick={() => onChange(lines.filter((_, j) => j !== i))}>
            Remove
          </Button>
        </div>
      ))}
      <div>
        <Button variant="secondary" size="sm" onClick={() => onChange([...lines, emptyLine()])}>
          Add a line
        </Button>
      </div>
    </fieldset>
  );
}
