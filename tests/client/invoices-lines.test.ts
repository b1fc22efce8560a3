// The invoice line form's schema: what the office typed → API lines (money in pence), each problem on its row's field.
import { describe, expect, it } from 'vitest';
import { linesFormSchema, type LineValues } from '../../src/features/invoices/components/line-form-schema';
import { creditLineFrom, creditNoteFormSchema } from '../../src/features/invoices/components/credit-note-form';
import { invoiceLineInputSchema } from '../../shared/api/invoices';

const line = (over: Partial<LineValues>): LineValues => ({
  description: 'Extra walkway board',
  quantity: '2',
  unitPriceMinor: '12.99',
  taxClass: 'standard',
  ...over,
});
const issues = (lines: LineValues[]) => {
  const r = linesFormSchema('GBP').safeParse(lines);
  return r.success ? [] : r.error.issues.map((i) => ({ path: i.path.join('.'), message: i.message }));
};

describe('invoice line form', () => {
  it('turns typed prices into integer pence the API accepts', () => {
    const r = linesFormSchema('GBP').parse([
      line({}),
      line({ description: 'Hatch kit', quantity: '1.5', unitPriceMinor: '£1,234.5', taxClass: 'energy_saving' }),
    ]);
    expect(r).toEqual([
      { description: 'Extra walkway board', quantity: 2, unit: 'each', unitPriceMinor: 1299, taxClass: 'standard' },
      { description: 'Hatch kit', quantity: 1.5, unit: 'each', unitPriceMinor: 123450, taxClass: 'energy_saving' },
    ]);
    for (const l of r) expect(invoiceLineInputSchema.safeParse(l).success).toBe(true);
  });

  it('skips blank rows and names each problem on its own row and field', () => {
    expect(linesFormSchema('GBP').parse([line({ description: '', unitPriceMinor: '' })])).toEqual([]);
    // The blank first row is dropped, but the problem stays on row 2, where it was typed.
    expect(issues([line({ description: '', unitPriceMinor: '' }), line({ unitPriceMinor: '12.999' })])).toEqual([
      { path: '1.unitPriceMinor', message: 'use at most 2 decimal places: type the amount like 1,234.50' },
    ]);
    // A price typed with a comma for pence is refused, not read as £2,690.00.
    expect(issues([line({ unitPriceMinor: '26,90' })])).toEqual([{ path: '0.unitPriceMinor', message: expect.stringMatching(/^26,90 cannot be read/) }]);
    expect(issues([line({ quantity: '0' })])).toEqual([{ path: '0.quantity', message: 'quantity must be above 0' }]);
    expect(issues([line({ quantity: '' })])).toEqual([{ path: '0.quantity', message: 'enter a quantity' }]);
    expect(issues([line({ description: ' ' })])).toEqual([{ path: '0.description', message: 'describe the line' }]);
  });
});

describe('credit note lines', () => {
  // A zero-rated line (installed energy-saving materials, HMRC VAT Notice 708/6) is credited at zero, not at 20 %.
  it('copies the credited line with its own tax class and price', () => {
    const credited = creditLineFrom(
      {
        id: 'l1',
        position: 1,
        source: 'quote',
        description: 'Mineral-wool roll 200 mm',
        quantity: 12,
        unit: 'roll',
        unitPriceMinor: 2350,
        taxClass: 'energy_saving',
        rateBp: 0,
        netMinor: 28200,
        taxMinor: 0,
        grossMinor: 28200,
      },
      'GBP',
    );
    expect(credited).toEqual({ description: 'Credit: Mineral-wool roll 200 mm', quantity: '12', unitPriceMinor: '23.50', taxClass: 'energy_saving' });
    expect(linesFormSchema('GBP').parse([credited])).toEqual([
      { description: 'Credit: Mineral-wool roll 200 mm', quantity: 12, unit: 'each', unitPriceMinor: 2350, taxClass: 'energy_saving' },
    ]);
  });

  it('needs a reason and at least one line left once blank rows are dropped', () => {
    const r = creditNoteFormSchema('GBP').safeParse({ reason: ' ', lines: [line({ description: '', unitPriceMinor: '' })], refund: false });
    expect(r.success ? [] : r.error.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
      ['reason', 'say why'],
      ['lines', 'add at least one line'],
    ]);
  });
});
