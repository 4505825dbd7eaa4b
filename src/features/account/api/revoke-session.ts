import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { okSchema } from '../../../../shared/schemas/common';
import { invalidateAfter } from '../../../lib/stale-after';

/** Revokes a session by the public id the session list gives; the session's cookie never reaches the page. */
export function revokeSession(publicId: string) {
  return apiClient.delete(`/api/account/sessions/${encodeURIComponent(publicId)}`, { schema: okSchema });
}

export function useRevokeSession() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeSession,
    onSettled: () => invalidateAfter(queryClient, 'account'),
  });
}
