// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { JobFormPage } from '../../src/app/job-form/job-form-page';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const CUSTOMER_ID = '11111111-1111-4111-8111-111111111111';
const INSTALLER_ID = '33333333-3333-4333-8333-333333333333';
const savedJob = { id: '22222222-2222-4222-8222-222222222222', reference: 'HF-0011' };

function fill(label: string, value: string, index = 0) {
  fireEvent.change(screen.getAllByLabelText(label, { exact: false })[index], { target: { value } });
}

function errorFor(label: string, index = 0): string | null {
  const el = screen.getAllByLabelText(label, { exact: false })[index];
  const id = el.getAttribute('aria-describedby')?.split(' ')[0];
  return id ? (document.getElementById(id)?.textContent ?? null) : null;
}

function api(opts: { jobStatus?: number; jobBody?: unknown } = {}) {
  return fakeApi(({ method, url }) => {
    if (url.pathname === '/api/customers' && method === 'GET') return { body: { customers: [] } };
    if (url.pathname === '/api/jobs/installers') return { body: { installers: [{ id: INSTALLER_ID, name: 'Ian Calder' }] } };
    if (url.pathname === '/api/customers' && method === 'POST') return { status: 201, body: { customer: { id: CUSTOMER_ID } } };
    if (url.pathname === '/api/jobs' && method === 'POST') return { status: opts.jobStatus ?? 201, body: opts.jobBody ?? { job: savedJob } };
    return undefined;
  });
}

describe('new job form', () => {
  it('names every missing field of a new customer beside it and sends nothing', async () => {
    const calls = api();
    renderPage(<JobFormPage onSaved={() => {}} />, { user: demoUser('estimator') });
    fireEvent.click(screen.getByRole('button', { name: 'Create job' }));
    // The form checks on submit, which settles a moment after the click.
    await waitFor(() => expect(errorFor('Customer name')).toBe('enter the customer name'));
    expect(errorFor('Address line 1')).toBe('enter the first line of the address');
    expect(errorFor('Town')).toBe('enter the town');
    expect(errorFor('Postcode')).toBe('enter the postcode');
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);
  });

  it('creates the customer first, then the job at the customer’s address', async () => {
    const calls = api();
    const onSaved = vi.fn();
    renderPage(<JobFormPage onSaved={onSaved} />, { user: demoUser('estimator') });
    fill('Customer name', 'Harriet Quayle');
    fill('Address line 1', '14 Wrenfield Road');
    fill('Town', 'Ashcombe');
    fill('Postcode', 'AB1 2CD');
    fireEvent.click(screen.getByRole('button', { name: 'Create job' }));
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
    const posts = calls.filter((c) => c.method === 'POST');
    expect(posts.map((c) => c.url.pathname)).toEqual(['/api/customers', '/api/jobs']);
    expect(posts[1].body).toMatchObject({
      customerId: CUSTOMER_ID,
      stage: 'enquiry',
      propertyAddress: { line1: '14 Wrenfield Road', town: 'Ashcombe', postcode: 'AB1 2CD' },
    });
    // An estimator does not assign installers, so the body must not mention them (the server forbids it).
    expect(posts[1].body).not.toHaveProperty('assignedInstallerId');
  });

  it('shows a server error next to the property field it names and does not create the customer twice', async () => {
    const calls = api({
      jobStatus: 422,
      jobBody: { error: { code: 'validation_failed', message: 'bad', details: [{ path: 'propertyAddress.postcode', message: 'not a postcode we know' }] } },
    });
    renderPage(<JobFormPage onSaved={() => {}} />, { user: demoUser('office') });
    fill('Customer name', 'Gideon Pell');
    fill('Address line 1', '3 Tanner Close');
    fill('Town', 'Ashcombe');
    fill('Postcode', 'ZZ');
    fireEvent.click(screen.getByLabelText(/The property is the customer's address/));
    fill('Address line 1', '3 Tanner Close', 1);
    fill('Town', 'Ashcombe', 1);
    fill('Postcode', 'ZZ', 1);
    fireEvent.click(screen.getByRole('button', { name: 'Create job' }));
    await screen.findByText('not a postcode we know');
    // After the customer exists, the form switches to it; a second try posts only the job.
    fireEvent.click(screen.getByRole('button', { name: 'Create job' }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'POST' && c.url.pathname === '/api/jobs')).toHaveLength(2));
    expect(calls.filter((c) => c.method === 'POST' && c.url.pathname === '/api/customers')).toHaveLength(1);
  });

  it('lets the office assign an installer and an install date', async () => {
    const calls = api();
    const onSaved = vi.fn();
    renderPage(<JobFormPage onSaved={onSaved} />, { user: demoUser('office') });
    fill('Customer name', 'Samuel Okonjo');
    fill('Address line 1', '2 Heron Court');
    fill('Town', 'Kelsworth');
    fill('Postcode', 'KW3 6NP');
    await screen.findByRole('option', { name: 'Ian Calder' });
    fill('Installer', INSTALLER_ID);
    fill('Install date', '2027-01-18');
    fireEvent.click(screen.getByRole('button', { name: 'Create job' }));
    await waitFor(() => expect(onSaved).toHaveBeenCalled());
    expect(calls.find((c) => c.method === 'POST' && c.url.pathname === '/api/jobs')!.body).toMatchObject({
      assignedInstallerId: INSTALLER_ID,
      installDate: '2027-01-18',
    });
  });
});
