// @vitest-environment happy-dom
import { cleanup, screen } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import QuotePage from '../../src/features/quotes/components/quote-page';
import { demoUser, fakeApi, renderPage } from './render';

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const JOB_ID = '44444444-4444-4444-8444-444444444444';
const QUOTE_ID = '55555555-5555-4555-8555-555555555555';

describe('quote page when the quote cannot be loaded', () => {
  it("says so (a 404: unknown or another company's quote) instead of loading for ever", async () => {
    fakeApi(() => ({ status: 404, body: { error: { code: 'not_found', message: 'quote not found' } } }));
    renderPage(<QuotePage />, { user: demoUser('office'), path: `/jobs/${JOB_ID}/quotes/${QUOTE_ID}`, routePath: '/jobs/:id/quotes/:quoteId' });
    expect(await screen.findByText('The quote could not be loaded')).toBeTruthy();
    expect(screen.queryByText('Loading the quote…')).toBeNull();
  });
});
