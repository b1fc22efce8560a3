// @vitest-environment happy-dom
// The quote lines editor on react-hook-form with the form schema built from quotePatchSchema: a
// typing mistake and the server's 422 both land on the row and field they name (aria-invalid, the
// message by aria-describedby), and a normal edit sends the body the editor sent before the form.
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Quote } from '../../shared/api/quotes';
import QuotePage from '../../src/features/quotes/components/quote-page';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const JOB_ID = '44444444-4444-4444-8444-444444444444';
const QUOTE_ID = '55555555-5555-4555-8555-555555555555';
const line = (over: Partial<Quote['lines'][number]>): Quote['lines'][number] => ({
  id: 'x',
  position: 1,
  kind: 'custom',
  description: '',
  quantity: 1,
  unit: 'each',
  unitPriceMinor: 0,
  unitCostMinor: 0,
  taxClass: 'standard',
  productId: null,
  extraKind: null,
  altQuantity: null,
  note: '',
  netMinor: 0,
  costMinor: 0,
  rateBp: 0,
  taxMinor: 0,
  ...over,
});
const quote: Quote = {
  id: QUOTE_ID,
  jobId: JOB_ID,
  number: 'QT-0042',
  version: 1,
  status: 'draft',
  currency: 'GBP',
  locale: 'en-GB',
  issueDate: '2030-01-10',
  validUntil: '2030-02-09',
  lines: [
    line({
      id: 'l1',
      position: 1,
      kind: 'material',
      description: 'Mineral wool roll 200 mm',
      quantity: 12,
      unit: 'roll',
      unitPriceMinor: 2499,
      unitCostMinor: 1600,
      taxClass: 'energy_saving',
      productId: 'p-200',
      altQuantity: 10,
      note: 'rule of thumb: 10 rolls',
    }),
    line({ id: 'l2', position: 2, kind: 'extra', description: 'Pipe lagging', quantity: 2.345, unit: 'm', unitPriceMinor: 199, extraKind: 'pipe_lagging' }),
    line({
      id: 'l3',
      position: 3,
      kind: 'labour',
      description: 'Labour, 2 installers',
      quantity: 6.5,
      unit: 'h',
      unitPriceMinor: 3200,
      unitCostMinor: 1900,
      taxClass: 'energy_saving',
    }),
  ],
  totals: { netMinor: 0, taxByRate: [], taxMinor: 0, grossMinor: 0, costMinor: 0, marginMinor: 0, marginBp: 0 },
  saving: null,
  deposit: null,
  taxRates: [
    { taxClass: 'energy_saving', rateBp: 0, validFrom: '2022-04-01' },
    { taxClass: 'standard', rateBp: 2000, validFrom: '2011-01-04' },
  ],
  personHours: 13,
  siteHours: 6.5,
  warnings: [],
  cautions: ['Keep the eaves ventilation clear.'],
  customerBeforeInstall: [],
  notes: 'Access by the side gate.',
  sentAt: null,
  acceptedAt: null,
  acceptedName: null,
  declinedAt: null,
  declineReason: null,
  versions: [{ id: QUOTE_ID, version: 1, status: 'draft' }],
  createdAt: '2030-01-10T09:00:00Z',
  updatedAt: '2030-01-10T09:00:00Z',
};

type Answer = { status?: number; body?: unknown };
function quoteApi(opts: { quote?: Quote; patch?: Answer } = {}) {
  const q = opts.quote ?? quote;
  return fakeApi(({ method, url }) => {
    if (url.pathname === `/api/quotes/${QUOTE_ID}` && method === 'GET') return { body: { quote: q } };
    if (url.pathname === `/api/quotes/${QUOTE_ID}` && method === 'PATCH') return opts.patch ?? { body: { quote: q } };
    return undefined;
  });
}
const patches = (calls: ReturnType<typeof fakeApi>) => calls.filter((c) => c.method === 'PATCH');

async function openQuote(user = demoUser('office')) {
  renderPage(<QuotePage />, { user, path: `/jobs/${JOB_ID}/quotes/${QUOTE_ID}`, routePath: '/jobs/:id/quotes/:quoteId' });
  await screen.findByRole('region', { name: 'Quote lines' });
}
const set = (label: string, value: string) => fireEvent.change(screen.getByLabelText(label), { target: { value } });

/** The message shown for the control labelled `label` (its aria-describedby), or null. */
function errorFor(label: string): string | null {
  const el = screen.getByLabelText(label);
  if (el.getAttribute('aria-invalid') !== 'true') return null;
  const id = el.getAttribute('aria-describedby')?.split(' ')[0];
  return id ? (document.getElementById(id)?.textContent ?? null) : null;
}
const save = () => fireEvent.click(screen.getByRole('button', { name: 'Save changes' }));

describe('quote lines editor', () => {
  it('sends the same body for a normal edit as the editor did before the form', async () => {
    const calls = quoteApi();
    await openQuote();
    set('Line 1 quantity', '14');
    set('Line 2 unit price', '£2.49');
    set('Line 2 tax class', 'energy_saving');
    set('Line 3 description', '  Labour, three installers ');
    fireEvent.click(screen.getByRole('button', { name: 'Add a line' }));
    set('Line 4 description', 'Loft hatch draught strip');
    set('Line 4 unit price', '18.5');
    set('Line 4 unit', '');
    fireEvent.click(screen.getByRole('button', { name: 'Remove line 2' }));
    set('Note printed on the quote', 'Access by the side gate; dog in the garden.');
    save();
    await screen.findByText('Saved.');
    // Captured from the editor before it moved onto the form (parseDraft), for these same steps.
    const before = {
      lines: [
        {
          kind: 'material',
          description: 'Mineral wool roll 200 mm',
          quantity: 14,
          unit: 'roll',
          unitPriceMinor: 2499,
          unitCostMinor: 1600,
          taxClass: 'energy_saving',
          productId: 'p-200',
          extraKind: null,
          altQuantity: 10,
          note: 'rule of thumb: 10 rolls',
        },
        {
          kind: 'labour',
          description: 'Labour, three installers',
          quantity: 6.5,
          unit: 'h',
          unitPriceMinor: 3200,
          unitCostMinor: 1900,
          taxClass: 'energy_saving',
          productId: null,
          extraKind: null,
          altQuantity: null,
          note: '',
        },
        {
          kind: 'custom',
          description: 'Loft hatch draught strip',
          quantity: 1,
          unit: 'each',
          unitPriceMinor: 1850,
          unitCostMinor: 0,
          taxClass: 'standard',
          productId: null,
          extraKind: null,
          altQuantity: null,
          note: '',
        },
      ],
      validUntil: '2030-02-09',
      notes: 'Access by the side gate; dog in the garden.',
    };
    expect(patches(calls).map((c) => c.body)).toEqual([before]);
  });

  it("names a bad price on its own row's price field, holds the totals and sends nothing", async () => {
    const calls = quoteApi();
    await openQuote();
    // 12 × £24.99 at 0% + 2.345 m × £1.99 (466.655 → 467) + 20% + 6.5 h × £32.00 at 0%: 29988 + 560 + 20800 = £513.48.
    expect(screen.getByTestId('total-gross').textContent).toBe('£513.48');
    set('Line 2 unit price', '2,49');
    await waitFor(() => expect(errorFor('Line 2 unit price')).toMatch(/^2,49 cannot be read as an amount here/));
    expect(errorFor('Line 1 unit price')).toBeNull();
    expect(errorFor('Line 3 unit price')).toBeNull();
    expect(errorFor('Line 2 quantity')).toBeNull();
    expect(screen.getByText('Fix the lines marked in red to see the totals.')).toBeTruthy();
    save();
    await screen.findByText('Some fields need attention.');
    expect(patches(calls)).toHaveLength(0);

    set('Line 2 unit price', '2.49');
    await waitFor(() => expect(errorFor('Line 2 unit price')).toBeNull());
    // Line 2 is now 2.345 × 249 = 583.905 → 584 + 116.8 → 117 VAT: 29988 + 701 + 20800 = £514.89, still at 20%.
    expect(screen.getByTestId('total-gross').textContent).toBe('£514.89');
    expect((screen.getByLabelText('Line 2 tax class') as HTMLSelectElement).value).toBe('standard');
  });

  it("places the server's 422 for lines.2.quantity on row 3's quantity", async () => {
    const details = [{ path: 'lines.2.quantity', message: 'more hours than the job allows' }];
    quoteApi({ patch: { status: 422, body: { error: { code: 'validation_failed', message: 'invalid body', details } } } });
    await openQuote();
    set('Line 3 quantity', '65');
    save();
    await waitFor(() => expect(errorFor('Line 3 quantity')).toBe('more hours than the job allows'));
    expect(errorFor('Line 2 quantity')).toBeNull();
    expect(errorFor('Line 3 unit price')).toBeNull();
    expect(screen.getByText('Some fields need attention.')).toBeTruthy();
    // Typing in the field clears the server's message; the client's own check then applies.
    set('Line 3 quantity', '7');
    await waitFor(() => expect(errorFor('Line 3 quantity')).toBeNull());
  });

  it('leaves out a row emptied of description and price, and still places the 422 on the row the server named', async () => {
    const details = [{ path: 'lines.1.unitPriceMinor', message: 'below the company minimum' }];
    const calls = quoteApi({ patch: { status: 422, body: { error: { code: 'validation_failed', message: 'invalid body', details } } } });
    await openQuote();
    set('Line 2 description', '');
    set('Line 2 unit price', '');
    save();
    // Sent: rows 1 and 3; the server's lines.1 is row 3.
    await waitFor(() => expect(errorFor('Line 3 unit price')).toBe('below the company minimum'));
    expect(errorFor('Line 2 unit price')).toBeNull();
    expect((patches(calls)[0].body as { lines: { description: string }[] }).lines.map((l) => l.description)).toEqual([
      'Mineral wool roll 200 mm',
      'Labour, 2 installers',
    ]);
  });

  it('asks for a description once a new row has a price, and leaves an untouched new row out', async () => {
    const calls = quoteApi();
    await openQuote();
    fireEvent.click(screen.getByRole('button', { name: 'Add a line' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add a line' }));
    set('Line 4 unit price', '40');
    await waitFor(() => expect(errorFor('Line 4 description')).toBe('describe the line'));
    expect(errorFor('Line 5 description')).toBeNull();
    set('Line 4 description', 'Hatch insulation kit');
    await waitFor(() => expect(errorFor('Line 4 description')).toBeNull());
    save();
    await screen.findByText('Saved.');
    expect((patches(calls)[0].body as { lines: unknown[] }).lines).toHaveLength(4);
  });

  it('shows an accepted quote as text: no inputs, no add, remove or save', async () => {
    quoteApi({ quote: { ...quote, status: 'accepted', acceptedName: 'Harriet Quayle', acceptedAt: '2030-01-12T10:00:00Z' } });
    await openQuote();
    const table = screen.getByRole('region', { name: 'Quote lines' });
    expect(within(table).queryAllByRole('textbox')).toHaveLength(0);
    expect(within(table).getByText('Mineral wool roll 200 mm')).toBeTruthy();
    expect(within(table).getByText('24.99')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Add a line' })).toBeNull();
    expect(screen.queryByRole('button', { name: /Remove line/ })).toBeNull();
    expect(screen.queryByRole('button', { name: /Save/ })).toBeNull();
    expect((screen.getByLabelText('Note printed on the quote') as HTMLTextAreaElement).disabled).toBe(true);
  });
});
