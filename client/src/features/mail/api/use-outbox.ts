import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { outboxEntrySchema, outboxListSchema, type OutboxEntry } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** Messages still on their way: while any is, the outbox is read again every few seconds. */
export const isUnderway = (m: OutboxEntry) => m.status === 'queued' || m.status === 'sending' || m.status === 'retrying';

/** GET /api/mail (admin): every message, newest first. */
export async function fetchOutbox(signal?: AbortSignal): Promise<OutboxEntry[]> {
  const body = await api.get('/api/mail', outboxListSchema, { signal });
  return [...body.messages].sort((a, b) => b.createdAt.localeCompare(a.createdAt) || b.id - a.id);
}

export function useOutbox() {
  return useQuery({
    queryKey: queryKeys.mail.list(),
    queryFn: ({ signal }) => fetchOutbox(signal),
    refetchInterval: (q) => (q.state.data?.some(isUnderway) ? 3000 : false),
  });
}

/** GET /api/mail/:id (admin): one message with its text. */
export async function fetchOutboxMessage(mailId: number, signal?: AbortSignal): Promise<OutboxEntry> {
  return api.get(apiPath`/api/mail/${mailId}`, outboxEntrySchema, { signal });
}

export function useOutboxMessage(mailId: number) {
  return useQuery({
    queryKey: queryKeys.mail.message(mailId),
    queryFn: ({ signal }) => fetchOutboxMessage(mailId, signal),
    refetchInterval: (q) => (q.state.data && isUnderway(q.state.data) ? 3000 : false),
  });
}

/** POST /api/mail/:id/retry (admin): send a message that is waiting or gave up, now. */
export async function retryMail(mailId: number): Promise<OutboxEntry> {
  return api.post(apiPath`/api/mail/${mailId}/retry`, outboxEntrySchema);
}

export function useRetryMail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: retryMail,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.mail.all }),
  });
}
