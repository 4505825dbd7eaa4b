import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { userSchema, type CreateUserRequest, type User } from '../../../../shared/schemas/users';
import { invalidateAfter } from '../../../lib/stale-after';

export function createUser(input: CreateUserRequest): Promise<User> {
  return apiClient.post('/api/users', input, { schema: userSchema });
}

export function useCreateUser() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createUser,
    onSuccess: () => invalidateAfter(queryClient, 'user'),
  });
}
