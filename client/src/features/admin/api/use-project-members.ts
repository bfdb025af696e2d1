import { useQuery } from '@tanstack/react-query';
import { projectMemberListSchema, type ProjectMember } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET /api/projects/:id/members: who has access to a project. */
export async function fetchProjectMembers(projectId: number, signal?: AbortSignal): Promise<ProjectMember[]> {
  const body = await api.get(apiPath`/api/projects/${projectId}/members`, projectMemberListSchema, { signal });
  return body.members;
}

export function useProjectMembers(projectId: number | null) {
  return useQuery({
    queryKey: queryKeys.projects.members(projectId ?? 0),
    queryFn: ({ signal }) => fetchProjectMembers(projectId as number, signal),
    enabled: projectId !== null,
  });
}
