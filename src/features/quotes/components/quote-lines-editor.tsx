import { TAX_CLASS_LABELS, type TaxClass } from '../../../../shared/api/settings';
import { formatMoney } from '../../../../shared/quote/money';
import { formatRateBp } from '../../../../shared/quote/tax';
import type { PricedLine, QuoteLineInput } from '../../../../shared/quote/totals';
import { Button, Table, TBody, Td, Th, THead, Tr } from '../../../components/ui';
import { blankLine, type DraftLine, type LineProblem } from './draft-lines';

/** Short names that fit the Tax column; the full name (TAX_CLASS_LABELS) goes in a title. */
const TAX_SHORT: Record<TaxClass, string> = { energy_saving: 'Energy-saving', standard: 'Standard' };

/** Tighter cell padding than the Table default so the seven columns fit the lines card at 1280 px. */
const pad = 'px-2!';

const box = 'rounded border border-graphite/25 bg-white/90 px-2 text-sm focus:outline-2 focus:outline-teal';
const cell = `h-9 ${box}`;

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
            <Th className={pad}>Item</Th>
            <Th className={`${pad} text-right`}>Qty</Th>
            <Th className={pad}>Unit</Th>
            <Th className={`${pad} text-right`}>Unit price</Th>
            <Th className={pad}>Tax</Th>
            <Th className={`${pad} text-right`}>Amount</Th>
            {/* relative: the absolutely placed sr-only label then sits inside the scrolling box instead of widening the page at 360 px */}
            {!readOnly && (
              <Th className={`${pad} relative`}>
                <span className="sr-only">Remove</span>
              </Th>
            )}
          </Tr>
        </THead>
        <TBody>
          {lines.map((l, i) => {
            const p = priced?.[i];
            return (
              <Tr key={l.key} data-testid="quote-line">
                <Td className={`${pad} min-w-[12rem]`}>
                  {readOnly ? (
                    <span>{l.description}</span>
                  ) : (
                    // One line of text, but wrapped over as many rows as it needs (field-sizing: content) so a long description stays readable in a narrow column.
                    <textarea
                      aria-label={`Line ${i + 1} description`}
                      rows={2}
                      className={`${box} block min-h-9 w-full resize-none py-1.5 leading-snug field-sizing-content`}
                      value={l.description}
                      onChange={(e) => set(l.key, { description: e.target.value.replace(/[\r\n]+/g, ' ') })}
                      onKeyDown={(e) => {
                        if (e.key === 'Enter') e.preventDefault();
                      }}
                      aria-invalid={!!problem(l.key, 'description') || undefined}
                    />
                  )}
                  <div className="mt-0.5 text-xs text-graphite-light">
                    <span className="font-mono uppercase text-timber">{l.kind}</span>
                    {l.note && <> · {l.note}</>}
                  </div>
                  {problem(l.key, 'description') && <p className="text-xs text-brick-dark">{problem(l.key, 'description')}</p>}
                </Td>
                <Td className={`${pad} text-right`}>
                  {readOnly ? (
                    <span className="font-mono">{l.quantityText}</span>
                  ) : (
                    <input
                      aria-label={`Line ${i + 1} quantity`}
                      inputMode="decimal"
                      className={`${cell} w-16 text-right font-mono`}
                      value={l.quantityText}
                      onChange={(e) => set(l.key, { quantityText: e.target.value })}
                      aria-invalid={!!problem(l.key, 'quantity') || undefined}
                    />
                  )}
                  {problem(l.key, 'quantity') && <p className="text-xs text-brick-dark">{problem(l.key, 'quantity')}</p>}
                </Td>
                <Td className={pad}>
                  {readOnly ? (
                    l.unit
                  ) : (
                    <input aria-label={`Line ${i + 1} unit`} className={`${cell} w-14`} value={l.unit} onChange={(e) => set(l.key, { unit: e.target.value })} />
                  )}
                </Td>
                <Td className={`${pad} text-right`}>
                  {readOnly ? (
                    <span className="font-mono">{l.priceText}</span>
                  ) : (
                    <input
                      aria-label={`Line ${i + 1} unit price`}
                      inputMode="decimal"
                      className={`${cell} w-20 text-right font-mono`}
                      value={l.priceText}
                      onChange={(e) => set(l.key, { priceText: e.target.value })}
                      aria-invalid={!!problem(l.key, 'price') || undefined}
                    />
                  )}
                  {problem(l.key, 'price') && <p className="text-xs text-brick-dark">{problem(l.key, 'price')}</p>}
                </Td>
                <Td className={pad}>
                  {readOnly ? (
                    <span className="text-xs" title={TAX_CLASS_LABELS[l.taxClass]}>
                      {TAX_SHORT[l.taxClass]}
                    </span>
                  ) : (
                    <select
                      aria-label={`Line ${i + 1} tax class`}
                      title={TAX_CLASS_LABELS[l.taxClass]}
                      className={`${cell} w-36`}
                      value={l.taxClass}
                      onChange={(e) => set(l.key, { taxClass: e.target.value as TaxClass })}
                    >
                      {(Object.keys(TAX_SHORT) as TaxClass[]).map((c) => (
                        <option key={c} value={c} title={TAX_CLASS_LABELS[c]}>
                          {TAX_SHORT[c]}
                        </option>
                      ))}
                    </select>
                  )}
                  {p && <div className="mt-0.5 font-mono text-xs text-graphite-light">{formatRateBp(p.rateBp)}</div>}
                </Td>
                <Td className={`${pad} whitespace-nowrap text-right font-mono`}>{p ? formatMoney(p.netMinor, currency, locale) : '—'}</Td>
                {!readOnly && (
                  <Td className={pad}>
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
          <Button variant="secondary" size="sm" onClick={() => onChange([...lines, blankLine(currency, locale)])}>
            Add a line
          </Button>
        </div>
      )}
    </div>
  );
}
