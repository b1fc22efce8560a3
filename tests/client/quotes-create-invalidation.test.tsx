// @vitest-environment happy-dom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, renderHook, waitFor } from '@testing-library/react';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { useCreateQuote } from '../../src/features/quotes/api/create-quote';
import { jobKeys } from '../../src/features/jobs/api/keys';

afterEach(() => vi.unstubAllGlobals());

describe('building a quote from the job page', () => {
  it('marks the job (and its history, where the server writes "Quote … drafted") stale', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => new Response(JSON.stringify({ quote: { id: 'q1' } }), { status: 201, headers: { 'content-type': 'application/json' } })),
    );
    const qc = new QueryClient({ defaultOptions: { queries: { retry: false, staleTime: Infinity } } });
    const eventsKey = [...jobKeys.detail('job1'), 'events'];
    qc.setQueryData(eventsKey, [{ id: 'e1', kind: 'created' }]);
    const wrapper = ({ children }: { children: ReactNode }) => <QueryClientProvider client={qc}>{children}</QueryClientProvider>;
    const { result } = renderHook(() => useCreateQuote('job1'), { wrapper });
    expect(qc.getQueryState(eventsKey)?.isInvalidated).toBe(false);
    await act(async () => {
      await result.current.mutateAsync();
    });
    await waitFor(() => expect(qc.getQueryState(eventsKey)?.isInvalidated).toBe(true));
  });
});
