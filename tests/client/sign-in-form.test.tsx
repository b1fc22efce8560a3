// @vitest-environment happy-dom
import { cleanup, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { SignInForm } from '../../src/features/auth/components/sign-in-form';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function fill(label: string, value: string) {
  fireEvent.change(screen.getByLabelText(label), { target: { value } });
}

describe('sign-in form', () => {
  it('names both empty fields beside them and sends nothing', async () => {
    const calls = fakeApi(() => undefined);
    renderPage(<SignInForm onSignedIn={() => {}} />, { user: null });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    const email = screen.getByLabelText('E-mail');
    // The form checks on submit, which settles a moment after the click.
    await waitFor(() => expect(email.getAttribute('aria-invalid')).toBe('true'));
    expect(document.getElementById(email.getAttribute('aria-describedby')!.split(' ')[0])!.textContent).toBe('enter a valid e-mail address');
    const password = screen.getByLabelText('Password');
    expect(document.getElementById(password.getAttribute('aria-describedby')!.split(' ')[0])!.textContent).toBe('enter your password');
    expect(calls).toHaveLength(0);
  });

  it('rejects a malformed e-mail address but accepts the password', async () => {
    fakeApi(() => undefined);
    renderPage(<SignInForm onSignedIn={() => {}} />, { user: null });
    fill('E-mail', 'office-at-demo');
    fill('Password', 'quiltline-demo');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('enter a valid e-mail address')).toBeTruthy();
    expect(screen.getByLabelText('Password').getAttribute('aria-invalid')).toBeNull();
  });

  it("shows the server's message when the password is wrong", async () => {
    const calls = fakeApi(({ url }) =>
      url.pathname === '/api/auth/login'
        ? { status: 401, body: { error: { code: 'invalid_credentials', message: 'that e-mail and password do not match an active account' } } }
        : undefined,
    );
    const onSignedIn = vi.fn();
    renderPage(<SignInForm onSignedIn={onSignedIn} />, { user: null });
    fill('E-mail', 'Office@Demo.Example.com');
    fill('Password', 'wrong-password');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    expect((await screen.findByRole('alert')).textContent).toContain('do not match an active account');
    expect(calls[0].body).toEqual({ email: 'office@demo.example.com', password: 'wrong-password' });
    expect(onSignedIn).not.toHaveBeenCalled();
  });

  it('puts a field error from the server next to the field it names', async () => {
    fakeApi(() => ({
      status: 422,
      body: { error: { code: 'validation_failed', message: 'email: too long', details: [{ path: 'email', message: 'this address is blocked' }] } },
    }));
    renderPage(<SignInForm onSignedIn={() => {}} />, { user: null });
    fill('E-mail', 'office@demo.example.com');
    fill('Password', 'quiltline-demo');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    const message = await screen.findByText('this address is blocked');
    expect(screen.getByLabelText('E-mail').getAttribute('aria-describedby')).toContain(message.id);
  });

  it('hands the signed-in user on after a successful sign-in', async () => {
    const me = demoUser('estimator');
    fakeApi(({ url }) => (url.pathname === '/api/auth/login' ? { body: { user: me } } : undefined));
    const onSignedIn = vi.fn();
    renderPage(<SignInForm onSignedIn={onSignedIn} />, { user: null });
    fill('E-mail', me.email);
    fill('Password', 'quiltline-demo');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(onSignedIn).toHaveBeenCalledWith(me));
  });
});
