// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Job, JobStage } from '../../shared/api/jobs';
import JobsListPage from '../../src/app/routes/jobs-list';
import { demoUser, fakeApi, renderPage, type FakeCall } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function job(n: number, name: string, town: string, stage: JobStage): Job {
  return {
    id: `00000000-0000-4000-9000-00000000000${n}`,
    reference: `HF-00${n}`,
    customer: { id: `c${n}`, name, email: '', phone: '' },
    propertyAddress: { line1: `${n} Mill Lane`, line2: '', town, postcode: `HF${n} 1AA` },
    stage,
    assignedInstaller: null,
    installDate: null,
    accessNotes: '',
    notes: '',
    spaces: [],
    createdAt: '2026-11-01T10:00:00Z',
    updatedAt: '2026-11-02T10:00:00Z',
  };
}

const IAN = { id: '55555555-5555-4555-8555-555555555555', name: 'Ian Calder' };
const JOBS = [
  job(1, 'Amara Lindqvist', 'Hartsford', 'enquiry'),
  job(2, 'Bram Okafor', 'Upper Beck', 'quoted'),
  { ...job(3, 'Cleo Haddad', 'Hartsford', 'scheduled'), assignedInstaller: IAN, installDate: '2027-01-18' },
];

/** A fake of GET /api/jobs that filters like the server: q over name/town/reference, stage exact. */
function jobsApi(all: Job[]) {
  return fakeApi(({ url }) => {
    if (url.pathname === '/api/jobs/installers') return { body: { installers: [IAN] } };
    if (url.pathname !== '/api/jobs') return undefined;
    const q = url.searchParams.get('q')?.toLowerCase();
    const stage = url.searchParams.get('stage');
    const installerId = url.searchParams.get('installerId');
    const jobs = all.filter(
      (j) =>
        (!q || [j.customer.name, j.propertyAddress.town, j.reference].some((s) => s.toLowerCase().includes(q))) &&
        (!stage || j.stage === stage) &&
        (!installerId || j.assignedInstaller?.id === installerId),
    );
    return { body: { jobs } };
  });
}

const lastJobsQuery = (calls: FakeCall[]) => calls.filter((c) => c.url.pathname === '/api/jobs').at(-1)!.url.searchParams;
const table = () => screen.getByRole('table', { name: 'Jobs' });

describe('jobs list', () => {
  it('lists the jobs with their stage and a count', async () => {
    jobsApi(JOBS);
    renderPage(<JobsListPage />, { user: demoUser('office'), path: '/jobs' });
    await screen.findByRole('table', { name: 'Jobs' });
    expect(within(table()).getAllByRole('row')).toHaveLength(4);
    expect(within(table()).getByText('Quoted')).toBeTruthy();
    expect(screen.getByText('3 jobs')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'New job' })).toBeTruthy();
  });

  it('asks the server with the search words once typing pauses, and shows only the matches', async () => {
    const calls = jobsApi(JOBS);
    renderPage(<JobsListPage />, { user: demoUser('office'), path: '/jobs' });
    await screen.findByRole('table', { name: 'Jobs' });
    fireEvent.change(screen.getByLabelText('Search all jobs'), { target: { value: 'hartsford' } });
    await waitFor(() => expect(within(table()).getAllByRole('row')).toHaveLength(3));
    expect(lastJobsQuery(calls).get('q')).toBe('hartsford');
    expect(within(table()).queryByText('Bram Okafor')).toBeNull();
  });

  it('filters by stage and sorts in the order chosen', async () => {
    const calls = jobsApi(JOBS);
    renderPage(<JobsListPage />, { user: demoUser('estimator'), path: '/jobs' });
    await screen.findByRole('table', { name: 'Jobs' });
    fireEvent.change(screen.getByLabelText('Stage'), { target: { value: 'scheduled' } });
    await waitFor(() => expect(within(table()).getAllByRole('row')).toHaveLength(2));
    expect(within(table()).getByText('Cleo Haddad')).toBeTruthy();
    expect(lastJobsQuery(calls).get('stage')).toBe('scheduled');

    fireEvent.change(screen.getByLabelText('Sort all jobs by'), { target: { value: 'customer' } });
    fireEvent.click(screen.getByRole('button', { name: /switch to ascending/ }));
    await waitFor(() => expect(lastJobsQuery(calls).get('dir')).toBe('asc'));
    expect(lastJobsQuery(calls).get('sort')).toBe('customer');
  });

  it('asks the server for the order a header names, across all jobs, and the header says it', async () => {
    const calls = jobsApi(JOBS);
    renderPage(<JobsListPage />, { user: demoUser('office'), path: '/jobs' });
    await screen.findByRole('table', { name: 'Jobs' });
    const header = (name: RegExp) => within(table()).getByRole('columnheader', { name });
    expect(header(/Last changed/).getAttribute('aria-sort')).toBe('descending');
    expect(header(/Customer/).getAttribute('aria-sort')).toBe('none');
    // Columns the API cannot order by offer no sort button.
    expect(within(header(/Installer/)).queryByRole('button')).toBeNull();

    fireEvent.click(within(header(/Customer/)).getByRole('button'));
    await waitFor(() => expect(lastJobsQuery(calls).get('sort')).toBe('customer'));
    expect(lastJobsQuery(calls).get('dir')).toBe('asc');
    await waitFor(() => expect(header(/Customer/).getAttribute('aria-sort')).toBe('ascending'));
    expect(header(/Last changed/).getAttribute('aria-sort')).toBe('none');
    expect((screen.getByLabelText('Sort all jobs by') as HTMLSelectElement).value).toBe('customer');

    fireEvent.click(within(header(/Customer/)).getByRole('button'));
    await waitFor(() => expect(lastJobsQuery(calls).get('dir')).toBe('desc'));
    await waitFor(() => expect(header(/Customer/).getAttribute('aria-sort')).toBe('descending'));
  });

  it("pages through the server's pages with its cursor and stops after the last", async () => {
    const all = [0, 1, 2, 3, 4].map((n) => job(n, `Customer ${n}`, 'Hartsford', 'enquiry'));
    const calls = fakeApi(({ url }) => {
      if (url.pathname !== '/api/jobs') return undefined;
      const from = Number(url.searchParams.get('cursor') ?? 0);
      const next = from + 2 < all.length ? String(from + 2) : null;
      return { body: { jobs: all.slice(from, from + 2), nextCursor: next, count: all.length } };
    });
    renderPage(<JobsListPage />, { user: demoUser('office'), path: '/jobs' });
    await screen.findByRole('table', { name: 'Jobs' });
    const rows = () => within(table()).getAllByRole('row').length - 1;
    expect(rows()).toBe(2);
    expect(screen.getByText('Showing 2 of 5 jobs')).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Load more jobs' }));
    await waitFor(() => expect(rows()).toBe(4));
    expect(lastJobsQuery(calls).get('cursor')).toBe('2');
    fireEvent.click(screen.getByRole('button', { name: 'Load more jobs' }));
    await waitFor(() => expect(rows()).toBe(5));
    expect(lastJobsQuery(calls).get('cursor')).toBe('4');
    expect(screen.queryByRole('button', { name: 'Load more jobs' })).toBeNull();
    expect(within(table()).getByText('Customer 4')).toBeTruthy();
  });

  it("narrows the list to one installer's jobs", async () => {
    const calls = jobsApi(JOBS);
    renderPage(<JobsListPage />, { user: demoUser('office'), path: '/jobs' });
    await screen.findByRole('table', { name: 'Jobs' });
    await screen.findByRole('option', { name: 'Ian Calder' });
    fireEvent.change(screen.getByLabelText('Installer'), { target: { value: IAN.id } });
    await waitFor(() => expect(within(table()).getAllByRole('row')).toHaveLength(2));
    expect(lastJobsQuery(calls).get('installerId')).toBe(IAN.id);
    expect(within(table()).getByText('Cleo Haddad')).toBeTruthy();
  });

  it('says when nothing matches and clears the filters on request', async () => {
    jobsApi(JOBS);
    renderPage(<JobsListPage />, { user: demoUser('office'), path: '/jobs?q=nowhere' });
    expect(await screen.findByText('No jobs match')).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Clear search and filters' }));
    await screen.findByRole('table', { name: 'Jobs' });
    expect((screen.getByLabelText('Search all jobs') as HTMLInputElement).value).toBe('');
  });

  it('explains an empty company and offers a first job', async () => {
    jobsApi([]);
    renderPage(<JobsListPage />, { user: demoUser('office'), path: '/jobs' });
    expect(await screen.findByText('No jobs yet')).toBeTruthy();
    expect(screen.getAllByRole('link', { name: 'New job' }).length).toBeGreaterThan(0);
  });

  it('shows the error and retries when loading fails', async () => {
    let fail = true;
    fakeApi(({ url }) => {
      if (url.pathname !== '/api/jobs') return undefined;
      return fail ? { status: 500, body: { error: { code: 'internal', message: 'something went wrong on the server' } } } : { body: { jobs: JOBS } };
    });
    renderPage(<JobsListPage />, { user: demoUser('office'), path: '/jobs' });
    expect((await screen.findByRole('alert')).textContent).toMatch(/something went wrong on the server/i);
    fail = false;
    fireEvent.click(screen.getByRole('button', { name: 'Try again' }));
    await screen.findByRole('table', { name: 'Jobs' });
  });

  it('offers no new-job button to an installer', async () => {
    jobsApi(JOBS.slice(0, 1));
    renderPage(<JobsListPage />, { user: demoUser('installer'), path: '/jobs' });
    await screen.findByRole('table', { name: 'Jobs' });
    expect(screen.queryByRole('link', { name: 'New job' })).toBeNull();
  });
});
