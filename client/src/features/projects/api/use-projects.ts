import { useQuery } from '@tanstack/react-query';
import { projectListSchema, type Project } from '@shared/api';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET /api/projects: the projects the signed-in person may see. */
export async function fetchProjects(signal?: AbortSignal): Promise<Project[]> {
  const body = await api.get('/api/projects', projectListSchema, { signal });
  return body.projects;
}

export function useProjects() {
  return useQuery({
    queryKey: queryKeys.projects.list(),
    queryFn: ({ signal }) => fetchProjects(signal),
  });
}
