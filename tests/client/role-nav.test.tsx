// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Role } from '../../shared/auth/roles';
import { homePathFor, navItemsFor } from '../../src/app/nav-items';
import { RequireAuth } from '../../src/app/require-auth';
import JobsListPage from '../../src/app/routes/jobs-list';
import { createQueryClient } from '../../src/lib/query-client';
import { demoUser, fakeApi, renderRoutes } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// What each role must see (in this order) and must not see. Other features add links of their own
// (the Schedule, for one), so the check is "these, in order, and none of those".
const EXPECTED: Record<Role, { has: string[]; not: string[] }> = {
  office: { has: ['Jobs', 'Customers', 'Users', 'Settings', 'Outbox'], not: ['My jobs'] },
  estimator: { has: ['Jobs', 'Customers'], not: ['Users', 'Settings', 'Outbox', 'My jobs'] },
  installer: { has: ['My jobs'], not: ['Jobs', 'Customers', 'Users', 'Settings', 'Outbox'] },
};

function expectNav(labels: Array<string | null>, { has, not }: { has: string[]; not: string[] }) {
  expect(labels.filter((l) => has.includes(l ?? ''))).toEqual(has);
  expect(labels.filter((l) => not.includes(l ?? ''))).toEqual([]);
}

function renderShell(role: Role | null, opts: { outbox?: boolean } = {}) {
  const calls = fakeApi(({ url }) => {
    if (url.pathname === '/api/dev/outbox') return opts.outbox === false ? undefined : { body: { enabled: true, messages: [] } };
    if (url.pathname === '/api/auth/logout') return { status: 204 };
    return undefined;
  });
  const routes = [
    { path: '/sign-in', element: <p>sign-in page</p> },
    { path: '/', element: <RequireAuth />, children: [{ path: '*', element: <p>page body</p> }] },
  ];
  const r = renderRoutes(routes, { path: '/jobs', user: role ? demoUser(role) : null });
  return { ...r, calls };
}

const navLabels = () =>
  within(screen.getAllByRole('navigation', { name: 'Main' })[0])
    .getAllByRole('link')
    .map((a) => a.textContent);

describe('role-aware navigation', () => {
  it.each(Object.entries(EXPECTED) as [Role, { has: string[]; not: string[] }][])('gives %s its own links and none of the others', async (role, expected) => {
    renderShell(role);
    await screen.findByText('page body');
    await waitFor(() => expectNav(navLabels(), expected));
    const who = screen.getAllByTestId('signed-in-user')[0].textContent;
    expect(who).toContain(demoUser(role).name);
    expect(who).toContain('Hearthfield Insulation');
  });

  it('hides the outbox when the server has none (production)', async () => {
    renderShell('office', { outbox: false });
    await screen.findByText('page body');
    await waitFor(() => expect(navLabels()).not.toContain('Outbox'));
    expectNav(navLabels(), { has: ['Jobs', 'Customers', 'Users', 'Settings'], not: ['Outbox'] });
  });

  it('never asks for the outbox for roles that may not read it', async () => {
    const { calls } = renderShell('estimator');
    await screen.findByText('page body');
    expect(calls.some((c) => c.url.pathname === '/api/dev/outbox')).toBe(false);
  });

  it('sends a visitor who is not signed in to sign-in, keeping where they were going', async () => {
    const { router } = renderShell(null);
    await screen.findByText('sign-in page');
    expect(router.state.location.search).toBe('?next=%2Fjobs');
  });

  it('sends the person to sign in again when the session has expired mid-visit', async () => {
    fakeApi(({ url }) =>
      url.pathname === '/api/jobs'
        ? { status: 401, body: { error: { code: 'unauthenticated', message: 'sign in first' } } }
        : url.pathname === '/api/jobs/installers'
          ? { body: { installers: [] } }
          : { body: { enabled: true, messages: [] } },
    );
    const routes = [
      { path: '/sign-in', element: <p>sign-in page</p> },
      { path: '/', element: <RequireAuth />, children: [{ path: 'jobs', element: <JobsListPage /> }] },
    ];
    const { router } = renderRoutes(routes, { path: '/jobs?stage=quoted', user: demoUser('office'), queryClient: createQueryClient() });
    await screen.findByText('sign-in page');
    expect(router.state.location.search).toBe(`?next=${encodeURIComponent('/jobs?stage=quoted')}`);
  });

  it('signs out and returns to sign-in', async () => {
    const { calls, router } = renderShell('office');
    await screen.findByText('page body');
    fireEvent.click(screen.getAllByRole('button', { name: 'Sign out' })[0]);
    await screen.findByText('sign-in page');
    expect(calls.some((c) => c.url.pathname === '/api/auth/logout' && c.method === 'POST')).toBe(true);
    expect(router.state.location.pathname).toBe('/sign-in');
  });

  it('opens and closes the phone menu with the same links', async () => {
    renderShell('estimator');
    await screen.findByText('page body');
    const toggle = screen.getByRole('button', { name: /Menu/ });
    expect(toggle.getAttribute('aria-expanded')).toBe('false');
    fireEvent.click(toggle);
    expect(toggle.getAttribute('aria-expanded')).toBe('true');
    const menu = document.getElementById('phone-menu')!;
    expectNav(
      within(menu)
        .getAllByRole('link')
        .map((a) => a.textContent),
      EXPECTED.estimator,
    );
  });

  it('starts installers on their own list and everyone else on jobs', () => {
    expect(homePathFor(demoUser('installer'))).toBe('/my-jobs');
    expect(homePathFor(demoUser('estimator'))).toBe('/jobs');
    expect(navItemsFor(null)).toEqual([]);
  });
});
