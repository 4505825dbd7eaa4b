import { useMutation, useQuery, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { endpointQueryOptions } from '../../../lib/endpoint-query';
import { invalidateAfter } from '../../../lib/stale-after';
import { readinessSchema } from '../../../../shared/schemas/readiness';
import { roundupDetailSchema } from '../../../../shared/schemas/roundups';
import { editorialKeys } from './editorial-keys';

export function readinessQueryOptions(roundupId: number) {
  return endpointQueryOptions(
    [...editorialKeys.detail(roundupId), 'readiness'],
    `/api/roundups/${roundupId}/readiness`,
    readinessSchema,
  );
}

export function useReadiness(roundupId: number) {
  return useSuspenseQuery(readinessQueryOptions(roundupId)).data;
}

/** The same, without suspending: for a small summary on another page. */
export function useReadinessSummary(roundupId: number, enabled: boolean) {
  return useQuery({ ...readinessQueryOptions(roundupId), enabled });
}

export function useRequestReview(roundupId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => apiClient.post(`/api/roundups/${roundupId}/review-request`, {}, { schema: roundupDetailSchema }),
    onSuccess: () => Promise.all([invalidateAfter(queryClient, 'editorial'), invalidateAfter(queryClient, 'plan')]),
  });
}

export function useCellExclusion(roundupId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ cellId, reason }: { cellId: number; reason: string | null }) =>
      reason === null
        ? apiClient.delete(`/api/roundups/${roundupId}/cells/${cellId}/exclusion`, { schema: readinessSchema })
        : apiClient.put(
            `/api/roundups/${roundupId}/cells/${cellId}/exclusion`,
            { reason },
            { schema: readinessSchema },
          ),
    onSuccess: () => Promise.all([invalidateAfter(queryClient, 'editorial'), invalidateAfter(queryClient, 'plan')]),
  });
}
