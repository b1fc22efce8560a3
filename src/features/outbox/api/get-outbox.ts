import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OutboxResponse } from '../../../../shared/api/outbox';
import { api, isApiError } from '../../../lib/api-client';

export const outboxKeys = { all: ['outbox'] as const };

/** Messages held by the development fake SMTP server, newest first; `enabled` false with a real relay. */
export function getOutbox(signal?: AbortSignal): Promise<OutboxResponse> {
  return api.get<OutboxResponse>('/api/dev/outbox', undefined, signal);
}

export const outboxQueryOptions = () => queryOptions({ queryKey: outboxKeys.all, queryFn: ({ signal }) => getOutbox(signal) });

/** The outbox page's list; it checks again every few seconds, as mail arrives after the request that sent it. */
export function useOutbox() {
  return useQuery({ ...outboxQueryOptions(), refetchInterval: 3000 });
}

/**
 * Whether the server runs the outbox (development and tests; it is not mounted in production).
 * Asked only for roles that may read it; true until the server answers 404.
 */
export function useOutboxAvailable(enabled: boolean): boolean {
  const q = useQuery({ ...outboxQueryOptions(), enabled, staleTime: 5 * 60_000 });
  return !(q.isError && isApiError(q.error) && q.error.status === 404);
}
