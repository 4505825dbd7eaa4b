import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { okSchema } from '../../../../shared/schemas/common';
import { invalidateAfter } from '../../../lib/stale-after';

export function revokeSession(sessionId: string) {
  return apiClient.delete(`/api/account/sessions/${encodeURIComponent(sessionId)}`, { schema: okSchema });
}

export function useRevokeSession() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeSession,
    onSettled: () => invalidateAfter(queryClient, 'account'),
  });
}
