import { useQuery } from '@tanstack/react-query';
import { ifcModelListSchema, isJobFinished, type IfcModel } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET /api/projects/:pid/models */
export async function fetchModels(projectId: number, signal?: AbortSignal): Promise<IfcModel[]> {
  const body = await api.get(apiPath`/api/projects/${projectId}/models`, ifcModelListSchema, { signal });
  return body.models;
}

/** The project's models; re-read every 2 s while any latest revision is still being worked on. */
export function useModels(projectId: number) {
  return useQuery({
    queryKey: queryKeys.models.list(projectId),
    queryFn: ({ signal }) => fetchModels(projectId, signal),
    refetchInterval: (query) => (query.state.data?.some((m) => m.latestRevision && !isJobFinished(m.latestRevision.status)) ? 2000 : false),
  });
}
