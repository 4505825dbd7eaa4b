import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import {
  roundupDetailSchema,
  type CreateRoundupRequest,
  type RoundupDetail,
} from '../../../../shared/schemas/roundups';
import { invalidateAfter } from '../../../lib/stale-after';

export function createRoundup(input: CreateRoundupRequest): Promise<RoundupDetail> {
  return apiClient.post('/api/roundups', input, { schema: roundupDetailSchema });
}

export function useCreateRoundup() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createRoundup, onSuccess: () => invalidateAfter(queryClient, 'plan') });
}
