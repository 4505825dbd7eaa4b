import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointFieldQueryOptions } from '../../../lib/endpoint-query';
import { userListSchema } from '../../../../shared/schemas/users';
import { userKeys } from './user-keys';

export function usersQueryOptions() {
  return endpointFieldQueryOptions(userKeys.list(), '/api/users', userListSchema, 'users');
}

export function useUsers() {
  return useSuspenseQuery(usersQueryOptions()).data;
}
