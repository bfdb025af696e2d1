import { MutationCache, QueryCache, QueryClient } from '@tanstack/react-query';
import { ERROR_IDS } from '@shared/api';
import { isApiError } from './api-client';
import { queryKeys } from './query-keys';

/**
 * One QueryClient for the app.
 * - Client errors (4xx) are not retried: asking again gives the same answer.
 * - When any call says the session has ended (401 auth.required), the session is
 *   re-read, and the route guard sends the person to sign in.
 */
export function createQueryClient(): QueryClient {
  const onError = (error: unknown) => {
    if (isApiError(error, ERROR_IDS.unauthenticated)) {
      void client.invalidateQueries({ queryKey: queryKeys.session });
    }
  };
  const client: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError }),
    mutationCache: new MutationCache({ onError }),
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

/** Drop everything a previous user could see; keep the session entry. */
export function forgetUserData(client: QueryClient): void {
  client.removeQueries({ predicate: (q) => q.queryKey[0] !== queryKeys.session[0] });
}
