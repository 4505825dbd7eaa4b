import { apiClient } from '../../../lib/api-client';
import { userSchema, type UpdateUserRequest, type User } from '../../../../shared/schemas/users';
import { useChangeMutation } from '../../../lib/stale-after';

export interface UpdateUserInput {
  id: number;
  /** Only the fields that change: a role change, deactivation or password reset ends the user's sessions. */
  changes: UpdateUserRequest;
}

export function updateUser({ id, changes }: UpdateUserInput): Promise<User> {
  return apiClient.patch(`/api/users/${id}`, changes, { schema: userSchema });
}

export function useUpdateUser() {
  return useChangeMutation(updateUser, 'user');
}
