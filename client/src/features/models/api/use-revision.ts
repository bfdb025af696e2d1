import { useEffect, useRef } from 'react';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { isJobFinished, revisionSchema, type Revision } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET /api/projects/:pid/revisions/:rid */
export async function fetchRevision(projectId: number, revisionId: number, signal?: AbortSignal): Promise<Revision> {
  return api.get(apiPath`/api/projects/${projectId}/revisions/${revisionId}`, revisionSchema, { signal });
}

/**
 * One revision. While its import job is working the revision is read every second;
 * when the job finishes, the project's model list and results are refreshed.
 */
export function useRevision(projectId: number, revisionId: number) {
  const queryClient = useQueryClient();
  const query = useQuery({
    queryKey: queryKeys.models.revision(projectId, revisionId),
    queryFn: ({ signal }) => fetchRevision(projectId, revisionId, signal),
    enabled: Number.isInteger(revisionId) && revisionId > 0,
    refetchInterval: (q) => (q.state.data && isJobFinished(q.state.data.status) ? false : 1000),
    staleTime: 0,
  });

  const status = query.data?.status;
  const previous = useRef(status);
  useEffect(() => {
    const was = previous.current;
    previous.current = status;
    if (status && was && !isJobFinished(was) && isJobFinished(status)) {
      void queryClient.invalidateQueries({ queryKey: queryKeys.models.ofProject(projectId) });
      void queryClient.invalidateQueries({ queryKey: queryKeys.results.ofRevision(projectId, revisionId) });
    }
  }, [status, projectId, revisionId, queryClient]);

  return query;
}
