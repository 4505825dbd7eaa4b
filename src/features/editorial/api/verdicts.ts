import { queryOptions, useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient, apiRequest } from '../../../lib/api-client';
import { invalidateAfter } from '../../../lib/stale-after';
import {
  roundupVerdictsSchema,
  type RoundupVerdicts,
  type SetVerdictRequest,
} from '../../../../shared/schemas/verdicts';
import { editorialKeys } from './editorial-keys';

export function getVerdicts(roundupId: number, signal?: AbortSignal): Promise<RoundupVerdicts> {
  return apiClient.get(`/api/roundups/${roundupId}/verdicts`, { signal, schema: roundupVerdictsSchema });
}

export function verdictsQueryOptions(roundupId: number) {
  return queryOptions({
    queryKey: [...editorialKeys.detail(roundupId), 'verdicts'],
    queryFn: ({ signal }) => getVerdicts(roundupId, signal),
  });
}

export function useVerdicts(roundupId: number) {
  return useSuspenseQuery(verdictsQueryOptions(roundupId)).data;
}

export function useSetVerdict(roundupId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ entryId, body }: { entryId: number; body: SetVerdictRequest }) =>
      apiRequest(`/api/roundups/${roundupId}/verdicts/${entryId}`, {
        method: 'PUT',
        body: body,
        schema: roundupVerdictsSchema,
      }),
    onSuccess: () => invalidateAfter(queryClient, 'editorial'),
  });
}
