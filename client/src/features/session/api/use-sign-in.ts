import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sessionResponseSchema, type SessionResponse, type SignInRequest } from '@shared/api';
import { api, rememberCsrfToken } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { forgetUserData } from '../../../lib/query-client';
import { clearSignOutIntent } from '../hooks/sign-out-intent';

/** POST /api/session: sign in. The session id (and so the CSRF token) changes. */
export async function signIn(request: SignInRequest): Promise<SessionResponse> {
  const session = await api.post('/api/session', sessionResponseSchema, request);
  rememberCsrfToken(session.csrfToken);
  return session;
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: (session) => {
      clearSignOutIntent();
      forgetUserData(queryClient);
      queryClient.setQueryData(queryKeys.session, session);
    },
  });
}
