import { apiClient } from '../../../lib/api-client';
import { type ChangePasswordRequest } from '../../../../shared/schemas/auth';
import { okSchema } from '../../../../shared/schemas/common';
import { useChangeMutation } from '../../../lib/stale-after';

export function changePassword(input: ChangePasswordRequest) {
  return apiClient.post('/api/account/password', input, { schema: okSchema });
}

export function useChangePassword() {
  // The server ends every other session of the user, so the sessions list changes too.
  return useChangeMutation(changePassword, 'account');
}
