import type { TaxClass } from '../../../../shared/api/settings';
import { formatMoney } from '../../../../shared/quote/money';
import { formatRateBp } from '../../../../shared/quote/tax';
import type { PricedLine, QuoteLineInput } from '../../../../shared/quote/totals';
import { Button, Table, TBody, Td, Th, THead, Tr } from '../../../components/ui';
import { blankLine, type DraftLine, type LineProblem } from './draft-lines';

const TAX_SHORT: Record<TaxClass, string> = { energy_saving: 'Energy-saving (installed)', standard: 'Standard' };

const cell = 'h-9 rounded border border-graphite/25 bg-white/90 px-2 text-sm focus:outline-2 focus:outline-teal';

type Props = {
  lines: DraftLine[];
  priced: PricedLine<QuoteLineInput>[] | null;
  problems: LineProblem[];
  currency: string;
  locale: string;
  readOnly: boolean;
  onChange: (lines: DraftLine[]) => void;
};

/** The quote's lines as an editable table: description, quantity, unit, unit price, tax class; add and remove. */
export function QuoteLinesEditor({ lines, priced, problems, currency, locale, readOnly, onChange }: Props) {
  const set = (key: string, patch: Partial<DraftLine>) => onChange(lines.map((l) => (l.key === key ? { ...l, ...patch } : l)));
  const problem = (key: string, field: LineProblem['field']) => problems.find((p) => p.key === key && p.field === field)?.message;
  return (
    <div className="flex flex-col gap-2">
      <Table aria-label="Quote lines">
        <THead>
          <Tr>
            <Th className="min-w-[16rem]">Item</Th>
            <Th className="text-right">Qty</Th>
            <Th>Unit</Th>
            <Th className="text-right">Unit price</Th>
            <Th>Tax</Th>
            <Th className="text-right">Amount</Th>
            {!readOnly && <Th><span className="sr-only">Remove</span></Th>}
          </Tr>
        </THead>
        <TBody>
          {lines.map((l, i) => {
            const p = priced?.[i];
            return (
              <Tr key={l.key} data-testid="quote-line">
                <Td>
                  {readOnly ? (
                    <span>{l.description}</span>
                  ) : (
                    <input aria-label={`Line ${i + 1} description`} className={`${cell} w-full min-w-[16rem]`} value={l.description} onChange={(e) => set(l.key, { description: e.target.value })} aria-invalid={!!problem(l.key, 'description') || undefined} />
                  )}
                  <div className="mt-0.5 text-xs text-graphite-light">
                    <span className="font-mono uppercase text-timber">{l.kind}</span>
                    {l.note && <> · {l.note}</>}
                  </div>
                  {problem(l.key, 'description') && <p className="text-xs text-brick-dark">{problem(l.key, 'description')}</p>}
                </Td>
                <Td className="text-right">
                  {readOnly ? (
                    <span className="font-mono">{l.quantityText}</span>
                  ) : (
                    <input aria-label={`Line ${i + 1} quantity`} inputMode="decimal" className={`${cell} w-20 text-right font-mono`} value={l.quantityText} onChange={(e) => set(l.key, { quantityText: e.target.value })} aria-invalid={!!problem(l.key, 'quantity') || undefined} />
                  )}
                  {problem(l.key, 'quantity') && <p className="text-xs text-brick-dark">{problem(l.key, 'quantity')}</p>}
                </Td>
                <Td>
                  {readOnly ? l.unit : <input aria-label={`Line ${i + 1} unit`} className={`${cell} w-16`} value={l.unit} onChange={(e) => set(l.key, { unit: e.target.value })} />}
                </Td>
                <Td className="text-right">
                  {readOnly ? (
                    <span className="font-mono">{l.priceText}</span>
                  ) : (
                    <input aria-label={`Line ${i + 1} unit price`} inputMode="decimal" className={`${cell} w-24 text-right font-mono`} value={l.priceText} onChange={(e) => set(l.key, { priceText: e.target.value })} aria-invalid={!!problem(l.key, 'price') || undefined} />
                  )}
                  {problem(l.key, 'price') && <p className="text-xs text-brick-dark">{problem(l.key, 'price')}</p>}
                </Td>
                <Td>
                  {readOnly ? (
                    <span className="text-xs">{TAX_SHORT[l.taxClass]}</span>
                  ) : (
                    <select aria-label={`Line ${i + 1} tax class`} className={`${cell} w-44`} value={l.taxClass} onChange={(e) => set(l.key, { taxClass: e.target.value as TaxClass })}>
                      {(Object.keys(TAX_SHORT) as TaxClass[]).map((c) => (
                        <option key={c} value={c}>
                          {TAX_SHORT[c]}
                        </option>
                      ))}
                    </select>
                  )}
                  {p && <div className="mt-0.5 font-mono text-xs text-graphite-light">{formatRateBp(p.rateBp)}</div>}
                </Td>
                <Td className="text-right font-mono">{p ? formatMoney(p.netMinor, currency, locale) : '—'}</Td>
                {!readOnly && (
                  <Td>
                    <Button variant="danger-ghost" size="sm" aria-label={`Remove line ${i + 1}`} onClick={() => onChange(lines.filter((x) => x.key !== l.key))}>
                      ✕
                    </Button>
                  </Td>
                )}
              </Tr>
            );
          })}
        </TBody>
      </Table>
      {!readOnly && (
        <div>
          <Button variant="secondary" size="sm" onClick={() => onChange([...lines, blankLine()])}>
            Add a line
          </Button>
        </div>
      )}
    </div>
  );
}
