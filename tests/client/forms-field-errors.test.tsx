// @vitest-environment happy-dom
// Forms on react-hook-form with the API's zod schemas: the client's check and the server's 422 both
// land on the field they name (aria-invalid, the message by aria-describedby), and money typed in
// a form reaches the API as integer minor units through the one money parser.
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { CompanySettings, Product } from '../../shared/api/settings';
import SettingsPage from '../../src/features/settings/components/settings-page';
import { CustomerForm } from '../../src/features/customers/components/customer-form';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

/** The message shown for the control labelled `label` (its aria-describedby), or null. */
function errorFor(label: string, root: HTMLElement = document.body): string | null {
  const el = within(root).getByLabelText(label, { exact: false });
  if (el.getAttribute('aria-invalid') !== 'true') return null;
  const id = el.getAttribute('aria-describedby')?.split(' ')[0];
  return id ? (document.getElementById(id)?.textContent ?? null) : null;
}

// A tab is chosen on the pointer going down (the WAI-ARIA tabs pattern as Radix implements it).
const chooseTab = (tab: HTMLElement) => fireEvent.mouseDown(tab, { button: 0 });

function fill(label: string, value: string, root: HTMLElement = document.body) {
  fireEvent.change(within(root).getByLabelText(label, { exact: false }), { target: { value } });
}

const settings: CompanySettings = {
  companyName: 'Hearthfield Insulation',
  address: { line1: '4 Kiln Yard', line2: '', town: 'Ashcombe', postcode: 'AB1 2CD' },
  email: 'office@hearthfield.example.com',
  phone: '',
  taxNumber: '',
  terms: '',
  validityDays: 30,
  currency: 'GBP',
  locale: 'en-GB',
  degreeDays: 2462,
  fuelPriceMinorPerKwh: 6.5,
  heatingEfficiency: 0.85,
  wasteAllowance: 0.1,
  minOffcutMm: 500,
  rollCountMethod: 'packing',
  eavesMode: 'gap',
  hatchKitInsulationMm: 0,
  actualsRequired: ['rolls'],
  labour: {
    baseM2PerHour: 12,
    crossM2PerHour: 15,
    hourlyRateMinor: 3200,
    hourlyCostMinor: 1900,
    crewSize: 2,
    minimumChargeMinor: 18000,
    roundUpMinutes: 15,
    taxClass: 'energy_saving',
  },
  extraRules: { pipeLaggingMPerTank: 3, walkwayBoardsPerTank: 3, boardLegsPerM2: 4, disposalPerJob: 1, eavesTrays: true },
  hasLogo: false,
};

function settingsApi(opts: { putStatus?: number; putBody?: unknown } = {}) {
  return fakeApi(({ method, url, body }) => {
    if (url.pathname === '/api/settings' && method === 'GET') return { body: { settings } };
    if (url.pathname === '/api/settings' && method === 'PUT')
      return { status: opts.putStatus ?? 200, body: opts.putBody ?? { settings: { ...settings, ...(body as object) } } };
    if (url.pathname === '/api/catalogue/products' && method === 'GET') return { body: { items: [] as Product[] } };
    if (url.pathname === '/api/catalogue/products' && method === 'POST') return { status: opts.putStatus ?? 201, body: opts.putBody ?? { item: body } };
    return undefined;
  });
}

async function openPricing() {
  renderPage(<SettingsPage />, { user: demoUser('office') });
  chooseTab(await screen.findByRole('tab', { name: 'Labour, waste, eaves, savings' }));
  await screen.findByLabelText('Charge per person-hour');
}

describe('company settings form', () => {
  it('refuses a price it cannot read without guessing, on that field, and sends nothing', async () => {
    const calls = settingsApi();
    await openPricing();
    // "26,90" in en-GB is neither £2,690 nor £26.90: the money parser refuses it.
    fill('Charge per person-hour', '26,90');
    fill('Crew size', '');
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(errorFor('Charge per person-hour')).toMatch(/^26,90 cannot be read as an amount here/));
    expect(errorFor('Crew size')).toMatch(/number/);
    expect(errorFor('Cost per person-hour')).toBeNull();
    expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(0);
  });

  it('sends typed money as pence and the waste percentage as a fraction', async () => {
    const calls = settingsApi();
    await openPricing();
    fill('Charge per person-hour', '£1,234.50');
    fill('Minimum labour charge', '95');
    fill('Waste allowance', '7.5');
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await screen.findByText('Settings saved.');
    const put = calls.find((c) => c.method === 'PUT')!.body as { labour: Record<string, unknown>; wasteAllowance: number; extraRules: { eavesTrays: boolean } };
    expect(put.labour).toMatchObject({ hourlyRateMinor: 123450, hourlyCostMinor: 1900, minimumChargeMinor: 9500, crewSize: 2 });
    expect(put.wasteAllowance).toBeCloseTo(0.075, 10);
    expect(put.extraRules.eavesTrays).toBe(true);
    // A setting with no field here is sent back as it was, not reset to its default.
    expect(put).toMatchObject({ actualsRequired: ['rolls'], eavesMode: 'gap' });
  });

  it("shows the server's 422 next to the nested field it names", async () => {
    settingsApi({
      putStatus: 422,
      putBody: { error: { code: 'validation_failed', message: 'bad', details: [{ path: 'labour.minimumChargeMinor', message: 'above what any job costs' }] } },
    });
    await openPricing();
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(errorFor('Minimum labour charge')).toBe('above what any job costs'));
    expect(screen.getByText('Some fields need attention.')).toBeTruthy();
  });
});

describe('what installers must record on finishing (actualsRequired)', () => {
  const checkbox = (name: string) => screen.getByRole('checkbox', { name }) as HTMLInputElement;
  const lastPut = (calls: ReturnType<typeof settingsApi>) => calls.filter((c) => c.method === 'PUT').at(-1)!.body as { actualsRequired: string[] };

  it('shows the stored choice as ticked boxes and sends the boxes ticked', async () => {
    const calls = settingsApi();
    await openPricing();
    expect(checkbox('Rolls used and brought back').checked).toBe(true);
    expect(checkbox('Hours on site, per installer').checked).toBe(false);
    fireEvent.click(checkbox('Hours on site, per installer'));
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await screen.findByText('Settings saved.');
    expect(lastPut(calls).actualsRequired).toEqual(['rolls', 'hours']);

    fireEvent.click(checkbox('Rolls used and brought back'));
    fireEvent.click(checkbox('Hours on site, per installer'));
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'PUT')).toHaveLength(2));
    expect(lastPut(calls).actualsRequired).toEqual([]);
  });

  it('keeps the stored choice when the company tab is saved for something else', async () => {
    const calls = settingsApi();
    renderPage(<SettingsPage />, { user: demoUser('office') });
    await screen.findByLabelText('Phone');
    fill('Phone', '01632 960123');
    fireEvent.click(screen.getByRole('button', { name: 'Save settings' }));
    await screen.findByText('Settings saved.');
    const put = lastPut(calls) as { actualsRequired: string[]; phone: string };
    expect(put.phone).toBe('01632 960123');
    expect(put.actualsRequired).toEqual(['rolls']);
  });
});

describe('catalogue row form', () => {
  it('checks a product with the API schema and reads its price as pence', async () => {
    const calls = settingsApi();
    renderPage(<SettingsPage />, { user: demoUser('office') });
    chooseTab(await screen.findByRole('tab', { name: 'Products' }));
    fireEvent.click(await screen.findByRole('button', { name: 'Add' }));
    await screen.findByLabelText('Price');
    const form = document.querySelector('form')!;
    fill('Name', 'Mineral wool roll 200 mm');
    fill('Price', '12.999');
    fireEvent.click(within(form).getByRole('button', { name: 'Add' }));
    await waitFor(() => expect(errorFor('Price')).toBe('use at most 2 decimal places: type the amount like 1,234.50'));
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);

    fill('Price', '£23.50');
    fireEvent.click(within(form).getByRole('button', { name: 'Add' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'POST')).toHaveLength(1));
    expect(calls.find((c) => c.method === 'POST')!.body).toMatchObject({
      name: 'Mineral wool roll 200 mm',
      unitPriceMinor: 2350,
      roles: ['base', 'cross'],
      active: true,
    });
  });
});

describe('customer form', () => {
  it('names the empty required fields, then places the server’s refusal on the postcode', async () => {
    const calls = fakeApi(({ method, url }) =>
      url.pathname === '/api/customers' && method === 'POST'
        ? {
            status: 422,
            body: { error: { code: 'validation_failed', message: 'bad', details: [{ path: 'address.postcode', message: 'not a postcode we know' }] } },
          }
        : undefined,
    );
    renderPage(<CustomerForm onDone={() => {}} />, { user: demoUser('office') });
    fireEvent.click(screen.getByRole('button', { name: 'Add customer' }));
    await waitFor(() => expect(errorFor('Customer name')).toBe('enter the customer name'));
    expect(errorFor('Postcode')).toBe('enter the postcode');
    expect(errorFor('Phone')).toBeNull();
    expect(calls).toHaveLength(0);

    fill('Customer name', 'Harriet Quayle');
    fill('Address line 1', '14 Wrenfield Road');
    fill('Town', 'Ashcombe');
    fill('Postcode', 'ZZ9');
    await waitFor(() => expect(errorFor('Customer name')).toBeNull());
    fireEvent.click(screen.getByRole('button', { name: 'Add customer' }));
    await waitFor(() => expect(errorFor('Postcode')).toBe('not a postcode we know'));
    expect(errorFor('Town')).toBeNull();
  });
});
