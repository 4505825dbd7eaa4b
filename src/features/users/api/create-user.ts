import { createRecord } from '../../../lib/record-requests';
import { useChangeMutation } from '../../../lib/stale-after';
import { userSchema, type CreateUserRequest, type User } from '../../../../shared/schemas/users';

export function useCreateUser() {
  return useChangeMutation(createRecord<CreateUserRequest, User>('/api/users', userSchema), 'user');
}
