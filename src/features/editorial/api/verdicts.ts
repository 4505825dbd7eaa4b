import { useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';
import { roundupVerdictsSchema, type SetVerdictRequest } from '../../../../shared/schemas/verdicts';
import { roundupViewQueryOptions } from './roundup-view';

export function verdictsQueryOptions(roundupId: number) {
  return roundupViewQueryOptions(roundupId, 'verdicts', roundupVerdictsSchema);
}

export function useVerdicts(roundupId: number) {
  return useSuspenseQuery(verdictsQueryOptions(roundupId)).data;
}

export function useSetVerdict(roundupId: number) {
  return useChangeMutation(
    ({ entryId, body }: { entryId: number; body: SetVerdictRequest }) =>
      apiClient.put(`/api/roundups/${roundupId}/verdicts/${entryId}`, body, { schema: roundupVerdictsSchema }),
    'editorial',
  );
}
