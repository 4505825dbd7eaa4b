import { editRecord } from '../../../lib/record-requests';
import { useChangeMutation } from '../../../lib/stale-after';
import { userSchema, type UpdateUserRequest, type User } from '../../../../shared/schemas/users';

/** Sends only the fields that change: a role change, deactivation or password reset ends the user's sessions. */
export function useUpdateUser() {
  return useChangeMutation(editRecord<UpdateUserRequest, User>('/api/users', userSchema), 'user');
}
