import { useQuery } from '@tanstack/react-query';
import type { MemberRow } from '@shared/api';
import { decodeMemberColumns, memberColumnsSchema } from '@shared/api/member-columns';
import { api } from '../../../lib/api-client';

/** Under the revision's results key, so changes to results (forces, overrides) refresh the colours too. */
export const allMembersKey = (projectId: number, revisionId: number) => ['results', projectId, revisionId, 'model-view', 'all-members'] as const;

/**
 * Every member of a revision (the member table's rows, all candidates) in one compact answer:
 * GET …/revisions/:id/member-columns. One request instead of dozens of table pages; the server
 * builds it once per change of results and sends it gzipped.
 */
export async function fetchAllMembers(projectId: number, revisionId: number, signal?: AbortSignal): Promise<MemberRow[]> {
  return decodeMemberColumns(await api.get(`/api/projects/${projectId}/revisions/${revisionId}/member-columns`, memberColumnsSchema, { signal }));
}

export function useAllMembers(projectId: number, revisionId: number) {
  return useQuery({
    queryKey: allMembersKey(projectId, revisionId),
    queryFn: ({ signal }) => fetchAllMembers(projectId, revisionId, signal),
  });
}
