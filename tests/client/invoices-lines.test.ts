// The invoice line editor's conversion from what the office typed to API lines (money in pence).
import { describe, expect, it } from 'vitest';
import { toLineInputs, type DraftLine } from '../../src/features/invoices/components/line-editor';
import { creditLineFrom } from '../../src/features/invoices/components/credit-note-form';
import { invoiceLineInputSchema } from '../../shared/api/invoices';

const line = (over: Partial<DraftLine>): DraftLine => ({ description: 'Extra walkway board', quantity: '2', price: '12.99', taxClass: 'standard', ...over });

describe('invoice line editor', () => {
  it('turns typed prices into integer pence the API accepts', () => {
    const r = toLineInputs([line({}), line({ description: 'Hatch kit', quantity: '1.5', price: '£1,234.5', taxClass: 'energy_saving' })], 'GBP');
    expect(r).toEqual({
      lines: [
        { description: 'Extra walkway board', quantity: 2, unit: 'each', unitPriceMinor: 1299, taxClass: 'standard' },
        { description: 'Hatch kit', quantity: 1.5, unit: 'each', unitPriceMinor: 123450, taxClass: 'energy_saving' },
      ],
    });
    for (const l of (r as { lines: unknown[] }).lines) expect(invoiceLineInputSchema.safeParse(l).success).toBe(true);
  });

  it('skips empty rows and names the row of the first problem', () => {
    expect(toLineInputs([line({ description: '', price: '' })], 'GBP')).toEqual({ lines: [] });
    expect(toLineInputs([line({}), line({ price: '12.999' })], 'GBP')).toEqual({
      error: 'line 2, price: use at most 2 decimal places: type the amount like 1,234.50',
    });
    // A variation or credit-note price typed with a comma for pence is refused, not read as £2,690.00.
    expect(toLineInputs([line({ price: '26,90' })], 'GBP')).toEqual({ error: expect.stringMatching(/^line 1, price: 26,90 cannot be read/) });
    expect(toLineInputs([line({ quantity: '0' })], 'GBP')).toEqual({ error: 'line 1: the quantity must be above 0' });
    expect(toLineInputs([line({ description: ' ' })], 'GBP')).toEqual({ error: 'line 1: describe the line' });
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
    expect(credited).toEqual({ description: 'Credit: Mineral-wool roll 200 mm', quantity: '12', price: '23.50', taxClass: 'energy_saving' });
    expect(toLineInputs([credited], 'GBP')).toEqual({
      lines: [{ description: 'Credit: Mineral-wool roll 200 mm', quantity: 12, unit: 'each', unitPriceMinor: 2350, taxClass: 'energy_saving' }],
    });
  });
});
