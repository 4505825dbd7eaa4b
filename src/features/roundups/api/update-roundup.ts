import { apiClient } from '../../../lib/api-client';
import {
  roundupDetailSchema,
  type RoundupDetail,
  type UpdateRoundupRequest,
} from '../../../../shared/schemas/roundups';
import { useChangeMutation } from '../../../lib/stale-after';

export interface UpdateRoundupInput {
  id: number;
  changes: UpdateRoundupRequest;
}

export function updateRoundup({ id, changes }: UpdateRoundupInput): Promise<RoundupDetail> {
  return apiClient.patch(`/api/roundups/${id}`, changes, { schema: roundupDetailSchema });
}

export function useUpdateRoundup() {
  return useChangeMutation(updateRoundup, 'plan');
}
