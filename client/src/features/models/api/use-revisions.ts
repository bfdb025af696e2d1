import { useQuery } from '@tanstack/react-query';
import { revisionListSchema, type Revision } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET /api/projects/:pid/models/:modelId/revisions, newest first as the server sends them. */
export async function fetchRevisions(projectId: number, modelId: number, signal?: AbortSignal): Promise<Revision[]> {
  const body = await api.get(apiPath`/api/projects/${projectId}/models/${modelId}/revisions`, revisionListSchema, { signal });
  return body.revisions;
}

export function useRevisions(projectId: number, modelId: number, enabled = true) {
  return useQuery({
    queryKey: queryKeys.models.revisions(projectId, modelId),
    queryFn: ({ signal }) => fetchRevisions(projectId, modelId, signal),
    enabled,
  });
}
