import { useMutation, useQueryClient } from '@tanstack/react-query';
import { forcesReportSchema, type ForcesReportBody } from '@shared/api';
import { api, apiPath, isApiError } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** POST /api/projects/:pid/revisions/:rid/forces {csv} (engineers, admins). */
export function useApplyForces(projectId: number, revisionId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (csv: string): Promise<ForcesReportBody> => api.post(apiPath`/api/projects/${projectId}/revisions/${revisionId}/forces`, forcesReportSchema, { csv }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.results.ofRevision(projectId, revisionId) }),
  });
}

export interface ForcesProblem {
  line: number;
  message: string;
}

/** The per-row report of a refused forces file (422 forces.rejected), if that is what the error is. */
export function forcesProblems(error: unknown): ForcesProblem[] {
  if (!isApiError(error, 'forces.rejected')) return [];
  const details = error.details as { problems?: unknown } | undefined;
  if (!details || !Array.isArray(details.problems)) return [];
  return details.problems.filter(
    (p): p is ForcesProblem => !!p && typeof (p as ForcesProblem).line === 'number' && typeof (p as ForcesProblem).message === 'string',
  );
}
