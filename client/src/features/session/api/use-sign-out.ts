import { useMutation, useQueryClient } from '@tanstack/react-query';
import { sessionResponseSchema, type SessionResponse } from '@shared/api';
import { api, rememberCsrfToken } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';
import { forgetUserData } from '../../../lib/query-client';
import { markSignedOutDeliberately } from '../hooks/sign-out-intent';

/** DELETE /api/session: sign out. Answers with a fresh signed-out session. */
export async function signOut(): Promise<SessionResponse> {
  const session = await api.delete('/api/session', sessionResponseSchema);
  rememberCsrfToken(session.csrfToken);
  return session;
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: (session) => {
      markSignedOutDeliberately();
      queryClient.setQueryData(queryKeys.session, session);
      forgetUserData(queryClient);
    },
  });
}
