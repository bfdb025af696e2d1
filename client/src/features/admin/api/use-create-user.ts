import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userSchema, type CreateUserRequest, type User } from '@shared/api';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** POST /api/users (admin) → 201 User */
export async function createUser(request: CreateUserRequest): Promise<User> {
  return api.post('/api/users', userSchema, request);
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.users.all }),
  });
}
