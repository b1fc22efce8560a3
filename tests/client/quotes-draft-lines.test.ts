// The quote builder's typed lines: parsed to minor units with clear per-field problems, and priced
// with the same shared code as the server (live totals match the API's to the penny).
import { describe, expect, it } from 'vitest';
import type { Quote } from '../../shared/api/quotes';
import { computeQuoteTotals } from '../../shared/quote/totals';
import { blankLine, parseDraft, toDraft } from '../../src/features/quotes/components/draft-lines';

const quote = {
  currency: 'GBP',
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

describe('quote builder lines', () => {
  it('round-trips the API lines through the typed form without changing a penny', () => {
    const { body, problems } = parseDraft(toDraft(quote), 'GBP');
    expect(problems).toEqual([]);
    expect(body.map((l) => [l.quantity, l.unitPriceMinor, l.taxClass, l.productId, l.altQuantity])).toEqual([
      [12, 2499, 'energy_saving', 'p1', 10],
      [2.345, 199, 'standard', null, null],
    ]);
  });

  it('prices typed lines like the server: 12 × £24.99 at 5% and 2.345 m × £1.99 at 20% (worked by hand)', () => {
    // 29988 + 1499 VAT; 466.655 → 467 + 93.4 → 93 VAT; total 32047
    const { inputs } = parseDraft(toDraft(quote), 'GBP');
    const rates = [
      { taxClass: 'energy_saving' as const, rateBp: 500, validFrom: '2000-01-01' },
      { taxClass: 'standard' as const, rateBp: 2000, validFrom: '2000-01-01' },
    ];
    const t = computeQuoteTotals(inputs, rates, '2030-01-01');
    expect([t.netMinor, t.taxMinor, t.grossMinor]).toEqual([30455, 1592, 32047]);
  });

  it('names the line and field of each typing mistake', () => {
    const lines = toDraft(quote);
    lines[0] = { ...lines[0], priceText: '24.999' };
    lines[1] = { ...lines[1], quantityText: '1.2345' };
    const added = { ...blankLine(), description: '' };
    const { problems } = parseDraft([...lines, added], 'GBP');
    expect(problems).toEqual([
      { key: lines[0].key, field: 'price', message: 'use at most 2 decimal places: type the amount like 1,234.50' },
      { key: lines[1].key, field: 'quantity', message: 'use at most three decimals' },
      { key: added.key, field: 'description', message: 'describe the line' },
    ]);
  });

  it('refuses "26,90" as a unit price instead of pricing it at £2,690.00', () => {
    const lines = toDraft(quote);
    lines[0] = { ...lines[0], priceText: '26,90' };
    const { problems, body } = parseDraft(lines, 'GBP', 'en-GB');
    expect(problems).toEqual([{ key: lines[0].key, field: 'price', message: expect.stringContaining('cannot be read') }]);
    expect(body[0].unitPriceMinor).not.toBe(269000);
  });
});
