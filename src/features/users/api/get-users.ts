import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { userListSchema, type User } from '../../../../shared/schemas/users';
import { userKeys } from './user-keys';

export async function getUsers(signal?: AbortSignal): Promise<User[]> {
  const { users } = await apiClient.get('/api/users', { signal, schema: userListSchema });
  return users;
}

export function usersQueryOptions() {
  return queryOptions({ queryKey: userKeys.list(), queryFn: ({ signal }) => getUsers(signal) });
}

export function useUsers() {
  return useSuspenseQuery(usersQueryOptions()).data;
}
