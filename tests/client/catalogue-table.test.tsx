// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { extraBodySchema } from '../../shared/api/settings';
import { CatalogueTable, type CatalogueColumn } from '../../src/features/settings/components/catalogue-table';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const COLUMNS: CatalogueColumn[] = [
  { key: 'name', label: 'Name', type: 'text', onPhone: true },
  { key: 'unit', label: 'Unit', type: 'select', options: ['each', 'm', 'job'].map((u) => ({ value: u, label: u })) },
  { key: 'unitPriceMinor', label: 'Price', type: 'money', onPhone: true },
  { key: 'minutesPerUnit', label: 'Minutes each', type: 'number' },
  { key: 'active', label: 'Active', type: 'bool', onPhone: true },
];
const extra = (id: string, name: string, unitPriceMinor: number, extra: object = {}) => ({
  id,
  kind: 'other',
  name,
  unit: 'each',
  unitPriceMinor,
  unitCostMinor: 0,
  minutesPerUnit: 10,
  taxClass: 'standard',
  active: true,
  ...extra,
});
// Prices chosen so that sorting the shown text ("£10.00" before "£9.50") would give the wrong order.
const EXTRAS = [extra('e1', 'Loft hatch cover', 950), extra('e2', 'Boarding offcut removal', 10_000, { unit: 'job' }), extra('e3', 'Pipe lagging', 1_000)];

function catalogueApi() {
  return fakeApi(({ method, url }) => {
    if (url.pathname === '/api/catalogue/extras' && method === 'GET') return { body: { items: EXTRAS } };
    if (url.pathname.startsWith('/api/catalogue/extras/') && method === 'DELETE') return { status: 204 };
    return undefined;
  });
}

function renderTable(columns = COLUMNS) {
  renderPage(
    <CatalogueTable
      resource="extras"
      title="Extras"
      columns={columns}
      schema={extraBodySchema}
      currency="GBP"
      blank={{ name: '', unit: 'each', unitPriceMinor: 0 }}
    />,
    { user: demoUser('office') },
  );
  return screen.findByRole('table', { name: 'Extras' });
}
const names = () =>
  within(screen.getByRole('table', { name: 'Extras' }))
    .getAllByRole('row')
    .slice(1)
    .map((r) => r.querySelector('td')!.textContent);

describe('catalogue table', () => {
  it('starts by name, sorts prices as amounts both ways from the header, which says its order', async () => {
    catalogueApi();
    const table = await renderTable();
    expect(names()).toEqual(['Boarding offcut removal', 'Loft hatch cover', 'Pipe lagging']);
    expect(within(table).getByRole('columnheader', { name: /Name/ }).getAttribute('aria-sort')).toBe('ascending');

    const price = within(table).getByRole('columnheader', { name: /Price/ });
    expect(price.getAttribute('aria-sort')).toBe('none');
    fireEvent.click(within(price).getByRole('button'));
    expect(price.getAttribute('aria-sort')).toBe('ascending');
    expect(names()).toEqual(['Loft hatch cover', 'Pipe lagging', 'Boarding offcut removal']);
    fireEvent.click(within(price).getByRole('button'));
    expect(price.getAttribute('aria-sort')).toBe('descending');
    expect(names()).toEqual(['Boarding offcut removal', 'Pipe lagging', 'Loft hatch cover']);
    expect(within(table).getByRole('columnheader', { name: /Name/ }).getAttribute('aria-sort')).toBe('none');
  });

  it('starts by the first column a phone shows, not by one it hides', async () => {
    catalogueApi();
    const kind: CatalogueColumn = { key: 'kind', label: 'Kind', type: 'select', options: [{ value: 'other', label: 'Other' }] };
    const table = await renderTable([kind, ...COLUMNS]);
    expect(within(table).getByRole('columnheader', { name: /Name/ }).getAttribute('aria-sort')).toBe('ascending');
    expect(within(table).getByRole('columnheader', { name: /Kind/ }).getAttribute('aria-sort')).toBe('none');
  });

  it('filters by every word of what the rows show, prices and choices included', async () => {
    catalogueApi();
    await renderTable();
    const filter = screen.getByLabelText('Filter Extras');
    fireEvent.change(filter, { target: { value: 'HATCH loft' } });
    expect(names()).toEqual(['Loft hatch cover']);
    fireEvent.change(filter, { target: { value: '£9.50' } });
    expect(names()).toEqual(['Loft hatch cover']);
    fireEvent.change(filter, { target: { value: 'job' } });
    expect(names()).toEqual(['Boarding offcut removal']);
    fireEvent.change(filter, { target: { value: 'chimney' } });
    expect(screen.getByText('Nothing matches the filter')).toBeTruthy();
    expect(screen.queryByRole('table', { name: 'Extras' })).toBeNull();
  });

  it("keeps each row's edit and delete, named for the row", async () => {
    const calls = catalogueApi();
    await renderTable();
    fireEvent.click(screen.getByRole('button', { name: 'Edit Pipe lagging' }));
    expect((screen.getByLabelText('Name', { selector: 'input' }) as HTMLInputElement).value).toBe('Pipe lagging');
    expect((screen.getByLabelText('Price', { selector: 'input' }) as HTMLInputElement).value).toBe('10.00');

    vi.stubGlobal('confirm', () => false);
    fireEvent.click(screen.getByRole('button', { name: 'Delete Loft hatch cover' }));
    expect(calls.some((c) => c.method === 'DELETE')).toBe(false);
    vi.stubGlobal('confirm', () => true);
    fireEvent.click(screen.getByRole('button', { name: 'Delete Loft hatch cover' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'DELETE' && c.url.pathname === '/api/catalogue/extras/e1')).toBe(true));
  });
});
