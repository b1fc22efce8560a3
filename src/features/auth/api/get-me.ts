import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Me } from '../../../../shared/api/auth';
import { api, isApiError } from '../../../lib/api-client';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

/** The signed-in user, or null when nobody is signed in (401). */
export async function getMe(signal?: AbortSignal): Promise<Me | null> {
  try {
    return (await api.get<{ user: Me }>('/api/auth/me', undefined, signal)).user;
  } catch (e) {
    if (isApiError(e) && e.status === 401) return null;
    throw e;
  }
}

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: ({ signal }) => getMe(signal), staleTime: 5 * 60_000 });

export function useMe() {
  return useQuery(meQueryOptions());
}
