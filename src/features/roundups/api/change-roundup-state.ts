import { apiClient } from '../../../lib/api-client';
import { roundupDetailSchema, type RoundupDetail } from '../../../../shared/schemas/roundups';
import type { RoundupState } from '../../../../shared/domain/planning/roundup-states';
import { useChangeMutation } from '../../../lib/stale-after';

export interface ChangeRoundupStateInput {
  id: number;
  to: RoundupState;
}

/** Moves the roundup one state forward; a 422 carries what blocks the move. */
export function changeRoundupState({ id, to }: ChangeRoundupStateInput): Promise<RoundupDetail> {
  return apiClient.post(`/api/roundups/${id}/state`, { to }, { schema: roundupDetailSchema });
}

export function useChangeRoundupState() {
  return useChangeMutation(changeRoundupState, 'plan');
}
