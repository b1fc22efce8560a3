import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { isApiError } from './api-client';

// The signed-in user's key (features/auth/api/get-me.ts); spelled out here so lib/ imports no feature.
const ME_KEY = ['auth', 'me'] as const;

/**
 * One QueryClient per app. Retries only what a retry could fix (not 4xx). When any call answers
 * 401 — the session expired or was signed out elsewhere — the cached user is cleared, so the
 * sign-in guard sends the person to sign in and back to where they were.
 */
export function createQueryClient(): QueryClient {
  const onError = (error: unknown, key?: readonly unknown[]) => {
    if (!isApiError(error) || error.status !== 401) return;
    if (key && key[0] === ME_KEY[0] && key[1] === ME_KEY[1]) return;
    if (client.getQueryData(ME_KEY)) client.setQueryData(ME_KEY, null);
  };
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError: (error, query) => onError(error, query.queryKey) }),
    mutationCache: new MutationCache({ onError: (error) => onError(error) }),
    defaultOptions: {
      queries: {
        staleTime: 30_000,
        refetchOnWindowFocus: false,
        retry: (failureCount, error) => {
          if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
          return failureCount < 2;
        },
      },
      mutations: { retry: false },
    },
  });
  return client;
}
