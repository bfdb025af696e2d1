import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { api, apiPath } from '../../../lib/api-client';

const acceptedSchema = z.object({ message: z.string() });

/** POST /api/users/:id/invitation (admin) → 202 {message}: a fresh one-time link by e-mail. */
export async function resendInvitation(userId: number): Promise<string> {
  const body = await api.post(apiPath`/api/users/${userId}/invitation`, acceptedSchema);
  return body.message;
}

export function useResendInvitation() {
  return useMutation({ mutationFn: resendInvitation });
}
