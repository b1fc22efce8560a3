// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { formatDateTime } from '../../shared/dates';
import type { Job } from '../../shared/api/jobs';
import JobDetailPage from '../../src/app/routes/job-detail';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const JOB_ID = '44444444-4444-4444-8444-444444444444';
const baseJob: Job = {
  id: JOB_ID,
  reference: 'JOB-2026-0006',
  customer: { id: 'c1', name: 'Samuel Okonjo', email: 'sam.okonjo@example.com', phone: '01632 960106' },
  propertyAddress: { line1: '2 Heron Court', line2: '', town: 'Kelsworth', postcode: 'KW3 6NP' },
  stage: 'accepted',
  assignedInstaller: { id: 'i1', name: 'Ian Calder' },
  installDate: '2027-01-18',
  accessNotes: 'Key with the neighbour at no. 4.',
  notes: '',
  spaces: [{ id: 's1', name: 'Main loft', latestRevision: 3, latestRevisionAt: '2026-11-25T15:30:00Z', updatedAt: '2026-11-20T10:00:00Z' }],
  createdAt: '2026-11-01T10:00:00Z',
  updatedAt: '2026-11-20T10:00:00Z',
};

function jobApi(over: Partial<Job> = {}, quotes: { status: string }[] = []) {
  let job = { ...structuredClone(baseJob), ...over };
  const removedSpaces: Job['spaces'] = [];
  const calls = fakeApi(({ method, url, body }) => {
    if (url.pathname === `/api/jobs/${JOB_ID}/quotes`)
      return {
        body: {
          quotes: quotes.map((q, i) => ({
            id: `q${i}`,
            number: `QT-000${i + 1}`,
            version: 1,
            currency: 'GBP',
            issueDate: '2026-11-20',
            validUntil: '2026-12-20',
            sentAt: null,
            grossMinor: 0,
            ...q,
          })),
        },
      };
    if (url.pathname === '/api/invoices') return { body: { invoices: [] } };
    if (url.pathname === `/api/payments/jobs/${JOB_ID}/timeline`) return { body: { entries: [] } };
    if (url.pathname === `/api/jobs/${JOB_ID}` && method === 'GET') return { body: { job } };
    if (url.pathname === `/api/jobs/${JOB_ID}` && method === 'PATCH') {
      job = { ...job, ...(body as Partial<Job>) };
      return { body: { job } };
    }
    if (url.pathname === `/api/jobs/${JOB_ID}/events`) return { body: { events: [] } };
    if (url.pathname === `/api/jobs/${JOB_ID}/spaces` && method === 'POST') {
      const space = { id: 's2', name: (body as { name: string }).name, latestRevision: null, latestRevisionAt: null, updatedAt: '2026-12-01T10:00:00Z' };
      job = { ...job, spaces: [...job.spaces, space] };
      return { status: 201, body: { space } };
    }
    if (url.pathname === '/api/spaces/s1' && method === 'DELETE') {
      removedSpaces.push(...job.spaces.filter((x) => x.id === 's1'));
      job = { ...job, spaces: job.spaces.filter((x) => x.id !== 's1') };
      return { status: 204 };
    }
    if (url.pathname === '/api/spaces/s1/restore' && method === 'POST') {
      job = { ...job, spaces: [...job.spaces, ...removedSpaces.splice(0)] };
      return { body: { space: job.spaces.find((x) => x.id === 's1') } };
    }
    return undefined;
  });
  return calls;
}

const render = (role: 'office' | 'estimator' | 'installer') =>
  renderPage(<JobDetailPage />, { user: demoUser(role), path: `/jobs/${JOB_ID}`, routePath: '/jobs/:id' });

describe('job detail', () => {
  it('shows the customer, property, installer, install date and spaces with a link to each plan', async () => {
    jobApi();
    render('office');
    await screen.findByRole('heading', { name: /Samuel Okonjo/ });
    expect(screen.getByText('2 Heron Court, Kelsworth KW3 6NP')).toBeTruthy();
    expect(screen.getByText('Ian Calder')).toBeTruthy();
    expect(screen.getByText('18 Jan 2027')).toBeTruthy();
    expect(screen.getByRole('link', { name: /Open plan/ }).getAttribute('href')).toBe('/spaces/s1/edit');
    // The latest revision with the time it was saved, not the space's own time.
    expect(screen.getByText(`revision 3 · saved ${formatDateTime('2026-11-25T15:30:00Z')}`)).toBeTruthy();
  });

  it('moves the job to another stage with a PATCH of the stage alone', async () => {
    const calls = jobApi();
    render('estimator');
    const select = (await screen.findByLabelText('Move to')) as HTMLSelectElement;
    // Only the moves the shared stage table allows from accepted, and the stage it is at.
    expect([...select.options].map((o) => o.value)).toEqual(['quoted', 'accepted', 'scheduled', 'declined']);
    fireEvent.change(select, { target: { value: 'scheduled' } });
    await waitFor(() => expect(calls.some((c) => c.method === 'PATCH')).toBe(true));
    expect(calls.find((c) => c.method === 'PATCH')!.body).toEqual({ stage: 'scheduled' });
    await waitFor(() => expect(screen.getByRole('heading', { name: /Samuel Okonjo/ }).textContent).toContain('Scheduled'));
  });

  it('asks for a name before adding a space, then lists the new space', async () => {
    const calls = jobApi();
    render('estimator');
    fireEvent.click(await screen.findByRole('button', { name: 'Add space' }));
    fireEvent.click(screen.getByRole('button', { name: 'Add' }));
    expect(await screen.findByText('name the space')).toBeTruthy();
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);
    fireEvent.change(screen.getByLabelText('Name of the space'), { target: { value: 'Garage loft' } });
    fireEvent.click(screen.getByRole('button', { name: 'Add' }));
    expect(await screen.findByText('Garage loft')).toBeTruthy();
    expect(screen.getByRole('link', { name: /Draw plan/ }).getAttribute('href')).toBe('/spaces/s2/edit');
  });

  it('removes a space at once and brings it back with Undo', async () => {
    const calls = jobApi();
    render('estimator');
    fireEvent.click(await screen.findByRole('button', { name: 'Remove Main loft' }));
    const undo = await screen.findByRole('button', { name: 'Undo' });
    expect(screen.getByText(/“Main loft” removed/)).toBeTruthy();
    await waitFor(() => expect(screen.queryByRole('link', { name: /Open plan/ })).toBeNull());
    fireEvent.click(undo);
    expect(await screen.findByRole('link', { name: /Open plan/ })).toBeTruthy();
    await waitFor(() => expect(screen.queryByRole('button', { name: 'Undo' })).toBeNull());
    expect(calls.filter((c) => c.method !== 'GET').map((c) => `${c.method} ${c.url.pathname}`)).toEqual([
      'DELETE /api/spaces/s1',
      'POST /api/spaces/s1/restore',
    ]);
  });

  it('gives an installer no edit, stage or add-space controls', async () => {
    jobApi();
    render('installer');
    await screen.findByRole('heading', { name: /Samuel Okonjo/ });
    expect(screen.queryByRole('link', { name: 'Edit job' })).toBeNull();
    expect(screen.queryByLabelText('Move to')).toBeNull();
    expect(screen.queryByRole('button', { name: 'Add space' })).toBeNull();
    expect(screen.queryByRole('button', { name: /^Remove / })).toBeNull();
  });

  it("does not ask an estimator's browser for invoices (office-only on the API: it answered 403)", async () => {
    const calls = jobApi();
    render('estimator');
    await screen.findByRole('heading', { name: /Samuel Okonjo/ });
    await screen.findByText('Payments');
    // The same card asks for the payment timeline on the same mount as it would ask for invoices:
    // once the timeline has arrived, an invoices request would have been made too.
    await screen.findByText('No deposit or invoice yet.');
    expect(calls.some((c) => c.url.pathname === `/api/payments/jobs/${JOB_ID}/timeline`)).toBe(true);
    expect(calls.filter((c) => c.url.pathname === '/api/invoices')).toHaveLength(0);
  });

  it("asks for the job's invoices as office", async () => {
    const calls = jobApi();
    render('office');
    await screen.findByRole('heading', { name: /Samuel Okonjo/ });
    await waitFor(() => expect(calls.some((c) => c.url.pathname === '/api/invoices' && c.url.searchParams.get('jobId') === JOB_ID)).toBe(true));
  });

  it('shows the not-found page for a job of another company', async () => {
    fakeApi(() => undefined);
    render('office');
    expect(await screen.findByText('Nothing on this page of the notebook')).toBeTruthy();
  });

  it('does not offer "Create invoice" for an installed job without an accepted quote, and says why', async () => {
    jobApi({ stage: 'installed' }, [{ status: 'draft' }]);
    render('office');
    expect((await screen.findByTestId('invoice-needs-quote')).textContent).toMatch(/No accepted quote/);
    expect(screen.queryByRole('button', { name: 'Create invoice' })).toBeNull();
  });

  it('offers "Create invoice" once the installed job has an accepted quote', async () => {
    jobApi({ stage: 'installed' }, [{ status: 'accepted' }]);
    render('office');
    expect(await screen.findByRole('button', { name: 'Create invoice' })).toBeTruthy();
  });
});
