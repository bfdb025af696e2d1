import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ChangePasswordRequest } from '@shared/api';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** PUT /api/session/password: 204 on success. */
export async function changePassword(request: ChangePasswordRequest): Promise<void> {
  await api.put('/api/session/password', null, request);
}

export function useChangePassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changePassword,
    // The server may renew the session on a password change: re-read it for a current CSRF token.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.session }),
  });
}
