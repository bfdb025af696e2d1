import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userSchema, type UpdateUserRequest, type User } from '@shared/api';
import { api, apiPath } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** PATCH /api/users/:id (admin): name, role, or active. */
export async function updateUser({ userId, changes }: { userId: number; changes: UpdateUserRequest }): Promise<User> {
  return api.patch(apiPath`/api/users/${userId}`, userSchema, changes);
}

export function useUpdateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateUser,
    onSuccess: (user) => {
      queryClient.setQueryData<User[]>(queryKeys.users.list(), (list) => list?.map((u) => (u.id === user.id ? user : u)));
      // Names and roles also show in project member lists.
      return Promise.all([
        queryClient.invalidateQueries({ queryKey: queryKeys.users.all }),
        queryClient.invalidateQueries({ queryKey: queryKeys.projects.all }),
      ]);
    },
  });
}
