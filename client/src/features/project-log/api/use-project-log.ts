import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { projectLogPageSchema, type ProjectLogKind, type ProjectLogPage } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

export interface ProjectLogRequest {
  page: number;
  pageSize: number;
  kind?: ProjectLogKind;
}

/** GET /api/projects/:projectId/audit (engineers and admins): one page of the log, newest first. */
export async function fetchProjectLog(projectId: number, params: Record<string, string>, signal?: AbortSignal): Promise<ProjectLogPage> {
  const search = new URLSearchParams(params).toString();
  return api.get(`${apiPath`/api/projects/${projectId}/audit`}?${search}`, projectLogPageSchema, { signal });
}

/** The log is read afresh on every visit (staleTime 0): exports and mails made elsewhere appear. */
export function useProjectLog(projectId: number, request: ProjectLogRequest) {
  const params: Record<string, string> = { page: String(request.page), pageSize: String(request.pageSize) };
  if (request.kind) params.kind = request.kind;
  return useQuery({
    queryKey: queryKeys.projectLog.page(projectId, params),
    queryFn: ({ signal }) => fetchProjectLog(projectId, params, signal),
    placeholderData: keepPreviousData,
    staleTime: 0,
  });
}
