import { QueryCache, QueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client.ts';

export const meQueryKey = ['auth', 'me'] as const;

/** Retrying a refusal (4xx) only repeats it; network hiccups and 5xx get two more tries. */
function shouldRetry(failureCount: number, error: unknown) {
  if (error instanceof ApiError && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

export function makeQueryClient() {
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({
      // A 401 on any query means the session ended (expired, or the account was deactivated).
      onError: (error, query) => {
        if (error instanceof ApiError && error.status === 401 && query.queryKey[0] !== meQueryKey[0]) {
          client.setQueryData(meQueryKey, { user: null });
        }
      },
    }),
    defaultOptions: {
      // offlineFirst: a query is tried once even without signal, so the service worker can answer from its cache instead of the page waiting.
      queries: { retry: shouldRetry, staleTime: 30_000, refetchOnWindowFocus: false, networkMode: 'offlineFirst' },
      // A write without signal fails at once with its message rather than pausing unseen (the outbox keeps photos and stops).
      mutations: { retry: false, networkMode: 'always' },
    },
  });
  return client;
}
