// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Role } from '../../shared/auth/roles';
import { homePathFor, navItemsFor } from '../../src/app/nav-items';
import { RequireAuth } from '../../src/app/require-auth';
import { demoUser, fakeApi, renderRoutes } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const EXPECTED: Record<Role, string[]> = {
  office: ['Jobs', 'Schedule', 'Customers', 'Users', 'Settings', 'Outbox'],
  estimator: ['Jobs', 'Schedule', 'Customers'],
  installer: ['My jobs'],
};

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

const navLabels = () => within(screen.getAllByRole('navigation', { name: 'Main' })[0]).getAllByRole('link').map((a) => a.textContent);

describe('role-aware navigation', () => {
  it.each(Object.entries(EXPECTED) as [Role, string[]][])('gives %s exactly its own links', async (role, expected) => {
    renderShell(role);
    await screen.findByText('page body');
    await waitFor(() => expect(navLabels()).toEqual(expected));
    const who = screen.getAllByTestId('signed-in-user')[0].textContent;
    expect(who).toContain(demoUser(role).name);
    expect(who).toContain('Hearthfield Insulation');
  });

  it('hides the outbox when the server has none (production)', async () => {
    renderShell('office', { outbox: false });
    await screen.findByText('page body');
    await waitFor(() => expect(navLabels()).toEqual(['Jobs', 'Schedule', 'Customers', 'Users', 'Settings']));
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
    expect(within(menu).getAllByRole('link').map((a) => a.textContent)).toEqual(['Jobs', 'Schedule', 'Customers']);
  });

  it('starts installers on their own list and everyone else on jobs', () => {
    expect(homePathFor(demoUser('installer'))).toBe('/my-jobs');
    expect(homePathFor(demoUser('estimator'))).toBe('/jobs');
    expect(navItemsFor(null)).toEqual([]);
  });
});
