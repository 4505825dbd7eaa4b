import { useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { endpointQueryOptions } from '../../../lib/endpoint-query';
import { useChangeMutation } from '../../../lib/stale-after';
import { roundupVerdictsSchema, type SetVerdictRequest } from '../../../../shared/schemas/verdicts';
import { editorialKeys } from './editorial-keys';

export function verdictsQueryOptions(roundupId: number) {
  return endpointQueryOptions(
    [...editorialKeys.detail(roundupId), 'verdicts'],
    `/api/roundups/${roundupId}/verdicts`,
    roundupVerdictsSchema,
  );
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
