import { useQuery } from '@tanstack/react-query';
import { sessionResponseSchema, type SessionResponse } from '@shared/api';
import { api, rememberCsrfToken } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET /api/session: who is signed in (or null), and the CSRF token for writes. */
export async function fetchSession(signal?: AbortSignal): Promise<SessionResponse> {
  const session = await api.get('/api/session', sessionResponseSchema, { signal });
  rememberCsrfToken(session.csrfToken);
  return session;
}

export function useSession() {
  return useQuery({
    queryKey: queryKeys.session,
    queryFn: ({ signal }) => fetchSession(signal),
    staleTime: 5 * 60_000,
    // Coming back to the tab re-checks that the session is still alive.
    refetchOnWindowFocus: true,
  });
}
