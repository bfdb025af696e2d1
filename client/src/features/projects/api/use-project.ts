import { useQuery } from '@tanstack/react-query';
import { projectSchema, type Project } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET /api/projects/:id */
export async function fetchProject(projectId: number, signal?: AbortSignal): Promise<Project> {
  return api.get(apiPath`/api/projects/${projectId}`, projectSchema, { signal });
}

export function useProject(projectId: number) {
  return useQuery({
    queryKey: queryKeys.projects.detail(projectId),
    queryFn: ({ signal }) => fetchProject(projectId, signal),
    enabled: Number.isInteger(projectId) && projectId > 0,
  });
}
