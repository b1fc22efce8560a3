// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import type { User } from '../../shared/api/users';
import UsersPage from '../../src/app/routes/users';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const me = demoUser('office');
const user = (id: string, name: string, role: User['role'], extra: Partial<User> = {}): User => ({
  id,
  email: `${name.split(' ')[0].toLowerCase()}@demo.example.com`,
  name,
  role,
  active: true,
  hasPassword: true,
  createdAt: '2026-11-01T09:00:00Z',
  ...extra,
});
const USERS = [user(me.id, me.name, 'office'), user('u-2', 'Ellis Harper', 'estimator'), user('u-3', 'Nell Ashworth', 'installer', { hasPassword: false })];

function usersApi() {
  return fakeApi(({ method, url, body }) => {
    if (url.pathname === '/api/users' && method === 'GET') return { body: { users: USERS } };
    if (url.pathname === '/api/users' && method === 'POST') {
      const b = body as { email: string };
      if (b.email === 'taken@demo.example.com')
        return {
          status: 409,
          body: { error: { code: 'conflict', message: 'taken', details: [{ path: 'email', message: 'someone already uses this address' }] } },
        };
      return { status: 201, body: { user: user('u-9', 'New Person', 'estimator', { hasPassword: false }) } };
    }
    const m = url.pathname.match(/^\/api\/users\/([^/]+)(\/resend-invite)?$/);
    if (m && method === 'PATCH') return { body: { user: { ...USERS.find((u) => u.id === m[1])!, ...(body as object) } } };
    if (m && m[2] && method === 'POST') return { body: { user: USERS.find((u) => u.id === m[1]) } };
    return undefined;
  });
}

const rowOf = (name: string) => screen.getByText(name).closest('tr')!;

describe('users page', () => {
  it('changes a role and deactivates a colleague, but never the signed-in user', async () => {
    const calls = usersApi();
    renderPage(<UsersPage />, { user: me });
    await screen.findByText('Ellis Harper');
    expect(within(rowOf(me.name)).queryByRole('button', { name: 'Deactivate' })).toBeNull();
    expect((within(rowOf(me.name)).getByRole('combobox') as HTMLSelectElement).disabled).toBe(true);

    fireEvent.change(screen.getByLabelText('Role of Ellis Harper'), { target: { value: 'installer' } });
    await waitFor(() => expect(calls.some((c) => c.method === 'PATCH' && c.url.pathname === '/api/users/u-2')).toBe(true));
    expect(calls.find((c) => c.method === 'PATCH')!.body).toEqual({ role: 'installer' });

    fireEvent.click(within(rowOf('Ellis Harper')).getByRole('button', { name: /^Deactivate/ }));
    await waitFor(() => expect(calls.filter((c) => c.method === 'PATCH').at(-1)!.body).toEqual({ active: false }));
  });

  it('offers to resend the invitation only to someone who has not set a password', async () => {
    const calls = usersApi();
    renderPage(<UsersPage />, { user: me });
    await screen.findByText('Nell Ashworth');
    expect(within(rowOf('Ellis Harper')).queryByRole('button', { name: 'Resend invite' })).toBeNull();
    fireEvent.click(within(rowOf('Nell Ashworth')).getByRole('button', { name: /^Resend invite/ }));
    expect(await screen.findByText(/A new invitation is on its way/)).toBeTruthy();
    expect(calls.some((c) => c.method === 'POST' && c.url.pathname === '/api/users/u-3/resend-invite')).toBe(true);
  });

  it('sorts by a header and finds people by any word of name, e-mail, role or status', async () => {
    usersApi();
    renderPage(<UsersPage />, { user: me });
    const table = await screen.findByRole('table', { name: 'Users' });
    const names = () =>
      within(table)
        .getAllByRole('row')
        .slice(1)
        .map((r) => r.querySelector('td .font-medium')!.textContent!.replace('(you)', '').trim());
    // Before a header is chosen: by role (office, estimator, installer).
    expect(names()).toEqual([me.name, 'Ellis Harper', 'Nell Ashworth']);
    const name = within(table).getByRole('columnheader', { name: /Name/ });
    fireEvent.click(within(name).getByRole('button'));
    expect(name.getAttribute('aria-sort')).toBe('ascending');
    expect(names()).toEqual(['Ellis Harper', 'Nell Ashworth', me.name]);
    fireEvent.click(within(name).getByRole('button'));
    expect(name.getAttribute('aria-sort')).toBe('descending');
    expect(names()).toEqual([me.name, 'Nell Ashworth', 'Ellis Harper']);

    const find = screen.getByLabelText('Find a user');
    fireEvent.change(find, { target: { value: 'invited' } });
    expect(names()).toEqual(['Nell Ashworth']);
    fireEvent.change(find, { target: { value: 'estimator ellis' } });
    expect(names()).toEqual(['Ellis Harper']);
    fireEvent.change(find, { target: { value: 'nobody here' } });
    expect(screen.getByText('No user matches')).toBeTruthy();
  });

  it('checks the invitation form and shows a conflict next to the e-mail field', async () => {
    const calls = usersApi();
    renderPage(<UsersPage />, { user: me });
    await screen.findByText('Ellis Harper');
    fireEvent.click(screen.getByRole('button', { name: 'Invite a colleague' }));
    fireEvent.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect(await screen.findByText('enter a name')).toBeTruthy();
    expect(screen.getByText('enter a valid e-mail address')).toBeTruthy();
    expect(calls.filter((c) => c.method === 'POST')).toHaveLength(0);

    const form = screen.getByRole('form', { name: 'Invite a colleague' });
    fireEvent.change(within(form).getByLabelText('Name', { exact: false }), { target: { value: 'Second Person' } });
    fireEvent.change(within(form).getByLabelText('E-mail', { exact: false }), { target: { value: 'taken@demo.example.com' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect(await screen.findByText('someone already uses this address')).toBeTruthy();

    fireEvent.change(within(form).getByLabelText('E-mail', { exact: false }), { target: { value: 'New.Person@Demo.Example.com' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send invitation' }));
    expect(await screen.findByText(/Invitation sent to/)).toBeTruthy();
    expect(calls.filter((c) => c.method === 'POST').at(-1)!.body).toEqual({ name: 'Second Person', email: 'new.person@demo.example.com', role: 'estimator' });
  });
});
