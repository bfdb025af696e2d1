import { keepPreviousData, useQuery } from '@tanstack/react-query';
import { memberPageSchema, type MemberPage } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET …/revisions/:rid/members?… (server-side paging, sorting, filters). `params` are already strings. */
export async function fetchMemberPage(projectId: number, revisionId: number, params: Record<string, string>, signal?: AbortSignal): Promise<MemberPage> {
  const search = new URLSearchParams(params).toString();
  return api.get(`${apiPath`/api/projects/${projectId}/revisions/${revisionId}/members`}?${search}`, memberPageSchema, { signal });
}

/** One page of the member ledger; the previous page stays on screen while the next loads. */
export function useMemberPage(projectId: number, revisionId: number, params: Record<string, string>) {
  return useQuery({
    queryKey: queryKeys.results.members(projectId, revisionId, params),
    queryFn: ({ signal }) => fetchMemberPage(projectId, revisionId, params, signal),
    placeholderData: keepPreviousData,
  });
}
