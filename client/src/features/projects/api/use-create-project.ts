import { useMutation, useQueryClient } from '@tanstack/react-query';
import { projectSchema, type CreateProjectRequest, type Project } from '@shared/api';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** POST /api/projects (admin, engineer) → 201 Project */
export async function createProject(request: CreateProjectRequest): Promise<Project> {
  return api.post('/api/projects', projectSchema, request);
}

export function useCreateProject() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createProject,
    onSuccess: (project) => {
      queryClient.setQueryData(queryKeys.projects.detail(project.id), project);
      return queryClient.invalidateQueries({ queryKey: queryKeys.projects.list() });
    },
  });
}
