import type { ReactNode } from 'react';
import { useController, useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import type { z } from 'zod';
import { TAX_CLASS_LABELS, type TaxClass } from '../../../../shared/api/settings';
import { formatMoney } from '../../../../shared/quote/money';
import { formatRateBp } from '../../../../shared/quote/tax';
import type { PricedLine } from '../../../../shared/quote/totals';
import { Button, Table, TBody, Td, Th, THead, Tr } from '../../../components/ui';
import { useFieldError } from '../../../lib/forms';
import { blankLine, type QuoteFormSchema, type QuoteLineValues } from './quote-form-schema';

/** Short names that fit the Tax column; the full name (TAX_CLASS_LABELS) goes in a title. */
const TAX_SHORT: Record<TaxClass, string> = { energy_saving: 'Energy-saving', standard: 'Standard' };

/** Tighter cell padding than the Table default so the seven columns fit the lines card at 1280 px. */
const pad = 'px-2!';

const box = 'rounded border border-graphite/25 bg-white/90 px-2 text-sm focus:outline-2 focus:outline-teal';
const cell = `h-9 ${box}`;

type FormInput = z.input<QuoteFormSchema>;
type Props = {
  /** Each row's price and tax, or null for a row left out (blank) or while a line cannot be read. */
  priced: (PricedLine | null)[] | null;
  currency: string;
  locale: string;
  readOnly: boolean;
};

/** A control and, under it, the form's message for `name` (the client's check or the server's 422 on that row). */
function Checked({ name, children }: { name: string; children: (props: ReturnType<typeof useFieldError>['props']) => ReactNode }) {
  const error = useFieldError(name);
  return (
    <>
      {children(error.props)}
      {error.node}
    </>
  );
}

/** The quote's lines as an editable table: description, quantity, unit, unit price, tax class; add and remove. */
export function QuoteLinesEditor({ priced, currency, locale, readOnly }: Props) {
  const { control } = useFormContext<FormInput>();
  const { fields, append, remove } = useFieldArray({ control, name: 'lines' });
  const lines = useWatch({ control, name: 'lines' });
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
          {fields.map((f, i) => (
            <LineRow
              key={f.id}
              index={i}
              line={lines[i] ?? f}
              priced={priced?.[i] ?? null}
              currency={currency}
              locale={locale}
              readOnly={readOnly}
              onRemove={() => remove(i)}
            />
          ))}
        </TBody>
      </Table>
      {!readOnly && (
        <div>
          <Button variant="secondary" size="sm" onClick={() => append(blankLine(currency, locale))}>
            Add a line
          </Button>
        </div>
      )}
    </div>
  );
}

/**
 * The tax class, controlled like FormSelect rather than registered: the select shows the form's
 * value for its row whatever the DOM did with it (registered, a row showed its first option in the
 * component tests, and a later read of the DOM priced the line with that).
 */
function TaxClassSelect({ name, label }: { name: `lines.${number}.taxClass`; label: string }) {
  const { field } = useController<FormInput, typeof name>({ name });
  return (
    <select aria-label={label} title={TAX_CLASS_LABELS[field.value]} className={`${cell} w-36`} {...field}>
      {(Object.keys(TAX_SHORT) as TaxClass[]).map((c) => (
        <option key={c} value={c} title={TAX_CLASS_LABELS[c]}>
          {TAX_SHORT[c]}
        </option>
      ))}
    </select>
  );
}

type RowProps = { index: number; line: QuoteLineValues; priced: PricedLine | null; currency: string; locale: string; readOnly: boolean; onRemove: () => void };

function LineRow({ index: i, line: l, priced: p, currency, locale, readOnly, onRemove }: RowProps) {
  const { register } = useFormContext<FormInput>();
  const at = <K extends keyof QuoteLineValues>(k: K) => `lines.${i}.${k}` as const;
  // Whether a row is blank (left out) or must be described turns on both fields, so each re-checks the other.
  const description = register(at('description'), { deps: [at('unitPriceMinor')] });
  return (
    <Tr data-testid="quote-line">
      <Td className={`${pad} min-w-[12rem]`}>
        {readOnly ? (
          <span>{l.description}</span>
        ) : (
          <Checked name={at('description')}>
            {(checked) => (
              // One line of text, but wrapped over as many rows as it needs (field-sizing: content) so a long description stays readable in a narrow column.
              <textarea
                aria-label={`Line ${i + 1} description`}
                rows={2}
                className={`${box} block min-h-9 w-full resize-none py-1.5 leading-snug field-sizing-content`}
                {...checked}
                {...description}
                onChange={(e) => {
                  // A pasted line break would end the description on the PDF; the text stays one line.
                  e.target.value = e.target.value.replace(/[\r\n]+/g, ' ');
                  return description.onChange(e);
                }}
                onKeyDown={(e) => {
                  if (e.key === 'Enter') e.preventDefault();
                }}
              />
            )}
          </Checked>
        )}
        <div className="mt-0.5 text-xs text-graphite-light">
          <span className="font-mono uppercase text-timber">{l.kind}</span>
          {l.note && <> · {l.note}</>}
        </div>
      </Td>
      <Td className={`${pad} text-right`}>
        {readOnly ? (
          <span className="font-mono">{l.quantity}</span>
        ) : (
          <Checked name={at('quantity')}>
            {(checked) => (
              <input
                aria-label={`Line ${i + 1} quantity`}
                inputMode="decimal"
                className={`${cell} w-16 text-right font-mono`}
                {...checked}
                {...register(at('quantity'))}
              />
            )}
          </Checked>
        )}
      </Td>
      <Td className={pad}>
        {readOnly ? (
          l.unit
        ) : (
          <Checked name={at('unit')}>
            {(checked) => <input aria-label={`Line ${i + 1} unit`} className={`${cell} w-14`} {...checked} {...register(at('unit'))} />}
          </Checked>
        )}
      </Td>
      <Td className={`${pad} text-right`}>
        {readOnly ? (
          <span className="font-mono">{l.unitPriceMinor}</span>
        ) : (
          <Checked name={at('unitPriceMinor')}>
            {(checked) => (
              <input
                aria-label={`Line ${i + 1} unit price`}
                inputMode="decimal"
                className={`${cell} w-20 text-right font-mono`}
                {...checked}
                {...register(at('unitPriceMinor'), { deps: [at('description')] })}
              />
            )}
          </Checked>
        )}
      </Td>
      <Td className={pad}>
        {readOnly ? (
          <span className="text-xs" title={TAX_CLASS_LABELS[l.taxClass]}>
            {TAX_SHORT[l.taxClass]}
          </span>
        ) : (
          <TaxClassSelect name={at('taxClass')} label={`Line ${i + 1} tax class`} />
        )}
        {p && <div className="mt-0.5 font-mono text-xs text-graphite-light">{formatRateBp(p.rateBp)}</div>}
      </Td>
      <Td className={`${pad} whitespace-nowrap text-right font-mono`}>{p ? formatMoney(p.netMinor, currency, locale) : '—'}</Td>
      {!readOnly && (
        <Td className={pad}>
          <Button variant="danger-ghost" size="sm" aria-label={`Remove line ${i + 1}`} onClick={onRemove}>
            ✕
          </Button>
        </Td>
      )}
    </Tr>
  );
}
