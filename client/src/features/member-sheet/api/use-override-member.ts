import { useMutation, useQueryClient } from '@tanstack/react-query';
import { memberRowSchema, type MemberOverrideRequest, type MemberRow } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/**
 * PATCH …/members/:globalId/overrides (engineers, admins): the member is checked again at
 * once; its sheet, audit trail, the ledger pages and the overview are read again.
 */
export function useOverrideMember(projectId: number, revisionId: number, globalId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (request: MemberOverrideRequest): Promise<MemberRow> =>
      api.patch(apiPath`/api/projects/${projectId}/revisions/${revisionId}/members/${globalId}/overrides`, memberRowSchema, request),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.results.ofRevision(projectId, revisionId) }),
  });
}
