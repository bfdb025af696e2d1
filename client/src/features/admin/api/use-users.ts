import { useQuery } from '@tanstack/react-query';
import { userListSchema, type User } from '@shared/api';
import { api } from '../../../lib/api-client';
import { queryKeys } from '../../../lib/query-keys';

/** GET /api/users (admin): everyone with an account. */
export async function fetchUsers(signal?: AbortSignal): Promise<User[]> {
  const body = await api.get('/api/users', userListSchema, { signal });
  return body.users;
}

export function useUsers() {
  return useQuery({
    queryKey: queryKeys.users.list(),
    queryFn: ({ signal }) => fetchUsers(signal),
  });
}
