import { editRecord } from '../../../lib/record-requests';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  roundupDetailSchema,
  type RoundupDetail,
  type UpdateRoundupRequest,
} from '../../../../shared/schemas/roundups';

export function useUpdateRoundup() {
  return useChangeMutation(
    editRecord<UpdateRoundupRequest, RoundupDetail>('/api/roundups', roundupDetailSchema),
    'plan',
  );
}
