import { useMutation } from '@tanstack/react-query';
import { z } from 'zod';
import { api } from '../../../lib/api-client';

const acceptedSchema = z.object({ message: z.string() });

/**
 * POST /api/session/password-reset → 202 {message}. The server gives the same answer
 * whether or not an account uses the address, so the page can only pass it on.
 */
export async function requestPasswordLink(request: { email: string }): Promise<string> {
  const body = await api.post('/api/session/password-reset', acceptedSchema, request);
  return body.message;
}

export function useRequestPasswordLink() {
  return useMutation({ mutationFn: requestPasswordLink });
}

/** POST /api/session/password-token → 204; 400 token.invalid when the link is used, expired or wrong. */
export async function setPasswordFromLink(request: { token: string; newPassword: string }): Promise<void> {
  await api.post('/api/session/password-token', null, request);
}

export function useSetPasswordFromLink() {
  return useMutation({ mutationFn: setPasswordFromLink });
}
