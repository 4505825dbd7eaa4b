import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { type ChangePasswordRequest } from '../../../../shared/schemas/auth';
import { okSchema } from '../../../../shared/schemas/common';
import { invalidateAfter } from '../../../lib/stale-after';

export function changePassword(input: ChangePasswordRequest) {
  return apiClient.post('/api/account/password', input, { schema: okSchema });
}

export function useChangePassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: changePassword,
    // The server ends every other session of the user, so the sessions list changes too.
    onSuccess: () => invalidateAfter(queryClient, 'account'),
  });
}
