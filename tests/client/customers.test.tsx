// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Customer } from '../../shared/api/customers';
import CustomersPage from '../../src/app/routes/customers';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const customer = (id: string, name: string, town: string, phone = ''): Customer => ({
  id,
  name,
  email: '',
  phone,
  address: { line1: '1 Mill Lane', line2: '', town, postcode: 'AB1 2CD' },
  createdAt: '2026-11-01T09:00:00Z',
});

function customersApi() {
  let list = [customer('c1', 'Harriet Quayle', 'Ashcombe', '01632 960101'), customer('c2', 'Gideon Pell', 'Bramley Cross')];
  const calls = fakeApi(({ method, url, body }) => {
    if (url.pathname === '/api/customers' && method === 'GET') return { body: { customers: list } };
    if (url.pathname === '/api/customers' && method === 'POST') {
      const created = { ...(body as Customer), id: 'c3', createdAt: '2026-12-01T09:00:00Z' };
      list = [...list, created];
      return { status: 201, body: { customer: created } };
    }
    const m = url.pathname.match(/^\/api\/customers\/(\w+)$/);
    if (m && method === 'PATCH') {
      list = list.map((c) => (c.id === m[1] ? { ...c, ...(body as Partial<Customer>) } : c));
      return { body: { customer: list.find((c) => c.id === m[1]) } };
    }
    return undefined;
  });
  return calls;
}

describe('customers page', () => {
  it('finds customers by any word of their name, contact or address', async () => {
    customersApi();
    renderPage(<CustomersPage />, { user: demoUser('estimator') });
    await screen.findByText('Harriet Quayle');
    fireEvent.change(screen.getByLabelText('Find a customer'), { target: { value: 'bramley' } });
    const table = screen.getByRole('table', { name: 'Customers' });
    expect(within(table).queryByText('Harriet Quayle')).toBeNull();
    expect(within(table).getByText('Gideon Pell')).toBeTruthy();
    fireEvent.change(screen.getByLabelText('Find a customer'), { target: { value: 'nobody' } });
    expect(screen.getByText('No customer matches')).toBeTruthy();
  });

  it('adds a customer after checking the required fields', async () => {
    const calls = customersApi();
    renderPage(<CustomersPage />, { user: demoUser('estimator') });
    await screen.findByText('Harriet Quayle');
    fireEvent.click(screen.getByRole('button', { name: 'New customer' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add customer' }));
    expect(await screen.findByText('enter the customer name')).toBeTruthy();
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);

    const form = screen.getByRole('form', { name: 'New customer' });
    const fill = (label: string, value: string) => fireEvent.change(within(form).getByLabelText(label, { exact: false }), { target: { value } });
    fill('Customer name', 'Mei Lin Hartley');
    fill('E-mail', 'not-an-address');
    fill('Address line 1', '27 Orchard Rise');
    fill('Town', 'Bramley Cross');
    fill('Postcode', 'BC2 3GH');
    fireEvent.click(screen.getByRole('button', { name: 'Add customer' }));
    expect(await screen.findByText('enter a valid e-mail address')).toBeTruthy();
    fill('E-mail', 'meilin.hartley@example.com');
    fireEvent.click(screen.getByRole('button', { name: 'Add customer' }));
    await waitFor(() => expect(screen.queryByRole('form', { name: 'New customer' })).toBeNull());
    expect(await screen.findByText('Mei Lin Hartley')).toBeTruthy();
    expect(calls.find((c) => c.method === 'POST')!.body).toMatchObject({
      name: 'Mei Lin Hartley',
      email: 'meilin.hartley@example.com',
      address: { town: 'Bramley Cross' },
    });
  });

  it('edits a customer in place', async () => {
    const calls = customersApi();
    renderPage(<CustomersPage />, { user: demoUser('office') });
    fireEvent.click(await screen.findByRole('button', { name: 'Edit Gideon Pell' }));
    const form = screen.getByRole('form', { name: 'Edit customer' });
    expect((within(form).getByLabelText('Town', { exact: false }) as HTMLInputElement).value).toBe('Bramley Cross');
    fireEvent.change(within(form).getByLabelText('Phone'), { target: { value: '01632 960102' } });
    fireEvent.click(screen.getByRole('button', { name: 'Save customer' }));
    await waitFor(() => expect(calls.some((c) => c.method === 'PATCH' && c.url.pathname === '/api/customers/c2')).toBe(true));
    await waitFor(() => expect(screen.queryByRole('form', { name: 'Edit customer' })).toBeNull());
    const row = within(screen.getByRole('table', { name: 'Customers' }))
      .getByText('Gideon Pell')
      .closest('tr')!;
    expect(row.textContent).toContain('01632 960102');
  });

  it('gives an installer no customers at all', async () => {
    const calls = customersApi();
    renderPage(<CustomersPage />, { user: demoUser('installer') });
    expect(await screen.findByText('Not available for your role')).toBeTruthy();
    expect(calls).toHaveLength(0);
  });
});
