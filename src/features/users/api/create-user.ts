import { apiClient } from '../../../lib/api-client';
import { userSchema, type CreateUserRequest, type User } from '../../../../shared/schemas/users';
import { useChangeMutation } from '../../../lib/stale-after';

export function createUser(input: CreateUserRequest): Promise<User> {
  return apiClient.post('/api/users', input, { schema: userSchema });
}

export function useCreateUser() {
  return useChangeMutation(createUser, 'user');
}
