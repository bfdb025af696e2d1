import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** PUT /api/projects/:id/members/:userId (admin) → 204: gives a person access to a project. */
export async function addProjectMember({ projectId, userId }: { projectId: number; userId: number }): Promise<void> {
  await api.put(apiPath`/api/projects/${projectId}/members/${userId}`, null);
}

export function useAddProjectMember() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: addProjectMember,
    onSuccess: (_void, { projectId }) => queryClient.invalidateQueries({ queryKey: queryKeys.projects.detail(projectId) }),
  });
}
