import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** DELETE /api/projects/:id/members/:userId (admin) → 204: takes away a person's access. */
export async function removeProjectMember({ projectId, userId }: { projectId: number; userId: number }): Promise<void> {
  await api.delete(apiPath`/api/projects/${projectId}/members/${userId}`, null);
}

export function useRemoveProjectMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: removeProjectMember,
    onSuccess: (_void, { projectId }) => queryClient.invalidateQueries({ queryKey: queryKeys.projects.detail(projectId) }),
  });
}
