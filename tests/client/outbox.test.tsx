// @vitest-environment happy-dom
import { cleanup, fireEvent, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import OutboxPage from '../../src/app/routes/outbox';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const message = (id: number, subject: string, text: string, replyTo = '') => ({
  id,
  receivedAt: `2026-12-01T10:0${id}:00Z`,
  from: 'Quiltline <no-reply@quiltline.example.com>',
  to: 'nell@demo.example.com',
  replyTo,
  subject,
  text,
  html: '',
  links: [],
});

describe('outbox page', () => {
  it('lists subject and recipient, opens the newest, and makes its links clickable without running HTML', async () => {
    fakeApi(({ url }) =>
      url.pathname === '/api/dev/outbox'
        ? {
            body: {
              enabled: true,
              messages: [
                message(2, 'Reset your password', 'Choose a new one: http://127.0.0.1:3000/reset-password?token=abc123DEF456.\n<b>not bold</b>'),
                message(1, "You're invited", 'Join here: http://127.0.0.1:3000/set-password?token=xyz', 'hello@hearthfold.example.com'),
              ],
            },
          }
        : undefined,
    );
    renderPage(<OutboxPage />, { user: demoUser('office') });
    await screen.findByText('Reset your password');
    expect(screen.getAllByText('to nell@demo.example.com')).toHaveLength(2);
    const link = screen.getByRole('link', { name: /reset-password/ });
    // The full stop after the address is prose, not part of the link.
    expect(link.getAttribute('href')).toBe('http://127.0.0.1:3000/reset-password?token=abc123DEF456');
    expect(screen.getByText(/<b>not bold<\/b>/)).toBeTruthy();
    expect(document.querySelector('pre b')).toBeNull();

    expect(screen.getByTestId('outbox-reply-to').textContent).toBe('no Reply-To: replies go to the sender');
    expect(screen.queryByRole('link', { name: /\/set-password/ })).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: /You're invited/ }));
    expect(screen.getByRole('link', { name: /\/set-password/ }).getAttribute('href')).toBe('http://127.0.0.1:3000/set-password?token=xyz');
    // The open message says where replies go.
    expect(screen.getByTestId('outbox-reply-to').textContent).toBe('replies go to hello@hearthfold.example.com');
  });

  it('says so when the server has no outbox (production)', async () => {
    fakeApi(() => undefined);
    renderPage(<OutboxPage />, { user: demoUser('office') });
    expect(await screen.findByText('No outbox on this server')).toBeTruthy();
  });

  it('is not shown to an estimator', async () => {
    const calls = fakeApi(() => ({ body: { enabled: true, messages: [] } }));
    renderPage(<OutboxPage />, { user: demoUser('estimator') });
    expect(await screen.findByText('Not available for your role')).toBeTruthy();
    expect(calls).toHaveLength(0);
  });
});
