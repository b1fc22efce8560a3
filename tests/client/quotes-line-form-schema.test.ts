// The quote builder's form schema (built from quotePatchSchema): typed lines read to minor units with
// each problem on its row's field, and priced with the same shared code as the server (live totals
// match the API's to the penny).
import { describe, expect, it } from 'vitest';
import { quotePatchSchema, type Quote } from '../../shared/api/quotes';
import { computeQuoteTotals } from '../../shared/quote/totals';
import { blankLine, keptRows, quoteFormSchema, quoteFormValues, type QuoteLineValues } from '../../src/features/quotes/components/quote-form-schema';

const quote = {
  currency: 'GBP',
  locale: 'en-GB',
  validUntil: '2030-02-09',
  notes: '',
  lines: [
    {
      id: 'a',
      position: 1,
      kind: 'material',
      description: 'Wool roll',
      quantity: 12,
      unit: 'roll',
      unitPriceMinor: 2499,
      unitCostMinor: 1600,
      taxClass: 'energy_saving',
      productId: 'p1',
      extraKind: null,
      altQuantity: 10,
      note: 'rule of thumb: 10 rolls',
      netMinor: 29988,
      costMinor: 19200,
      rateBp: 500,
      taxMinor: 1499,
    },
    {
      id: 'b',
      position: 2,
      kind: 'extra',
      description: 'Pipe lagging',
      quantity: 2.345,
      unit: 'm',
      unitPriceMinor: 199,
      unitCostMinor: 0,
      taxClass: 'standard',
      productId: null,
      extraKind: 'pipe_lagging',
      altQuantity: null,
      note: '',
      netMinor: 467,
      costMinor: 0,
      rateBp: 2000,
      taxMinor: 93,
    },
  ],
} as unknown as Quote;

const schema = quoteFormSchema('GBP', 'en-GB');
const withLines = (lines: QuoteLineValues[]) => ({ ...quoteFormValues(quote), lines });
const issues = (lines: QuoteLineValues[]) => {
  const r = schema.safeParse(withLines(lines));
  return r.success ? [] : r.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
};

describe('quote builder lines', () => {
  it('round-trips the API lines through the typed form without changing a penny', () => {
    const body = schema.parse(quoteFormValues(quote));
    expect(body.lines!.map((l) => [l.quantity, l.unitPriceMinor, l.taxClass, l.productId, l.altQuantity])).toEqual([
      [12, 2499, 'energy_saving', 'p1', 10],
      [2.345, 199, 'standard', null, null],
    ]);
    // What the form sends is what the server's own schema accepts, unchanged by it.
    expect(quotePatchSchema.parse(body)).toEqual(body);
  });

  it('prices typed lines like the server: 12 × £24.99 at 5% and 2.345 m × £1.99 at 20% (worked by hand)', () => {
    // 29988 + 1499 VAT; 466.655 → 467 + 93.4 → 93 VAT; total 32047
    const { lines } = schema.parse(quoteFormValues(quote));
    const rates = [
      { taxClass: 'energy_saving' as const, rateBp: 500, validFrom: '2000-01-01' },
      { taxClass: 'standard' as const, rateBp: 2000, validFrom: '2000-01-01' },
    ];
    const t = computeQuoteTotals(lines!, rates, '2030-01-01');
    expect([t.netMinor, t.taxMinor, t.grossMinor]).toEqual([30455, 1592, 32047]);
  });

  it('names the row and field of each typing mistake, by the path the server would use', () => {
    const lines = quoteFormValues(quote).lines;
    lines[0] = { ...lines[0], unitPriceMinor: '24.999' };
    lines[1] = { ...lines[1], quantity: '1.2345' };
    const added = { ...blankLine('GBP', 'en-GB'), unitPriceMinor: '12.50' };
    expect(issues([...lines, added, { ...added, description: 'Hatch kit', quantity: '' }])).toEqual([
      { path: 'lines.0.unitPriceMinor', message: 'use at most 2 decimal places: type the amount like 1,234.50' },
      { path: 'lines.1.quantity', message: 'use at most three decimals' },
      { path: 'lines.2.description', message: 'describe the line' },
      { path: 'lines.3.quantity', message: 'enter a quantity' },
    ]);
  });

  it('refuses "26,90" as a unit price instead of pricing it at £2,690.00', () => {
    const lines = quoteFormValues(quote).lines;
    lines[0] = { ...lines[0], unitPriceMinor: '26,90' };
    expect(issues(lines)).toEqual([{ path: 'lines.0.unitPriceMinor', message: expect.stringContaining('26,90 cannot be read') }]);
  });

  it('leaves out rows with neither a description nor a price, and keeps the other rows’ paths', () => {
    const [roll, lagging] = quoteFormValues(quote).lines;
    const blank = blankLine('GBP', 'en-GB');
    const rows = [roll, blank, { ...lagging, unitPriceMinor: '-' }, { ...blank, unitPriceMinor: '' }];
    expect(issues(rows)).toEqual([{ path: 'lines.2.unitPriceMinor', message: expect.stringContaining('is not an amount') }]);
    expect(keptRows(rows, 'GBP', 'en-GB')).toEqual([0, 2]);
    const sent = schema.parse(withLines([roll, blank, lagging, { ...blank, unitPriceMinor: '' }])).lines!;
    expect(sent.map((l) => l.description)).toEqual(['Wool roll', 'Pipe lagging']);
    // A blank unit is the API's default, as it was before the form.
    expect(schema.parse(withLines([{ ...lagging, unit: ' ' }])).lines![0].unit).toBe('each');
  });
});
