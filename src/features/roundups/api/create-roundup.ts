import { apiClient } from '../../../lib/api-client';
import {
  roundupDetailSchema,
  type CreateRoundupRequest,
  type RoundupDetail,
} from '../../../../shared/schemas/roundups';
import { useChangeMutation } from '../../../lib/stale-after';

export function createRoundup(input: CreateRoundupRequest): Promise<RoundupDetail> {
  return apiClient.post('/api/roundups', input, { schema: roundupDetailSchema });
}

export function useCreateRoundup() {
  return useChangeMutation(createRoundup, 'plan');
}
