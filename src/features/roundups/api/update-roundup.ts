import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import {
  roundupDetailSchema,
  type RoundupDetail,
  type UpdateRoundupRequest,
} from '../../../../shared/schemas/roundups';
import { invalidateAfter } from '../../../lib/stale-after';

export interface UpdateRoundupInput {
  id: number;
  changes: UpdateRoundupRequest;
}

export function updateRoundup({ id, changes }: UpdateRoundupInput): Promise<RoundupDetail> {
  return apiClient.patch(`/api/roundups/${id}`, changes, { schema: roundupDetailSchema });
}

export function useUpdateRoundup() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updateRoundup, onSuccess: () => invalidateAfter(queryClient, 'plan') });
}
