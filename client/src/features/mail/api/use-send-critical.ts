import { useMutation, useQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { projectMemberListSchema, type ProjectMember, type SendCriticalRequest } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

const sentSchema = z.object({ mailId: z.number().int(), members: z.number().int(), message: z.string() });
export type SendCriticalAnswer = z.infer<typeof sentSchema>;

/** POST /api/projects/:pid/revisions/:rid/send-critical (engineers, admins) → 202: the message is queued. */
export async function sendCritical({ projectId, revisionId, request }: { projectId: number; revisionId: number; request: SendCriticalRequest }): Promise<SendCriticalAnswer> {
  return api.post(apiPath`/api/projects/${projectId}/revisions/${revisionId}/send-critical`, sentSchema, request);
}

export function useSendCritical() {
  return useMutation({ mutationFn: sendCritical });
}

/** GET /api/projects/:id/members: the people on the project, to pick recipients from. */
export async function fetchProjectPeople(projectId: number, signal?: AbortSignal): Promise<ProjectMember[]> {
  const body = await api.get(apiPath`/api/projects/${projectId}/members`, projectMemberListSchema, { signal });
  return body.members;
}

export function useProjectPeople(projectId: number) {
  return useQuery({
    queryKey: queryKeys.projects.members(projectId),
    queryFn: ({ signal }) => fetchProjectPeople(projectId, signal),
  });
}
