import { useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';
import { readinessSchema } from '../../../../shared/schemas/readiness';
import { roundupDetailSchema } from '../../../../shared/schemas/roundups';
import { roundupViewQueryOptions } from './roundup-view';

export function readinessQueryOptions(roundupId: number) {
  return roundupViewQueryOptions(roundupId, 'readiness', readinessSchema);
}

export function useReadiness(roundupId: number) {
  return useSuspenseQuery(readinessQueryOptions(roundupId)).data;
}

/** The same, without suspending: for a small summary on another page. */
export function useReadinessSummary(roundupId: number, enabled: boolean) {
  return useQuery({ ...readinessQueryOptions(roundupId), enabled });
}

/** Sending to review and leaving a cell out change the editorial views and the roundup's plan alike. */
const reviewChanges = ['editorial', 'plan'] as const;

export function useRequestReview(roundupId: number) {
  return useChangeMutation(
    () => apiClient.post(`/api/roundups/${roundupId}/review-request`, {}, { schema: roundupDetailSchema }),
    reviewChanges,
  );
}

export function useCellExclusion(roundupId: number) {
  return useChangeMutation(
    ({ cellId, reason }: { cellId: number; reason: string | null }) =>
      reason === null
        ? apiClient.delete(`/api/roundups/${roundupId}/cells/${cellId}/exclusion`, { schema: readinessSchema })
        : apiClient.put(
            `/api/roundups/${roundupId}/cells/${cellId}/exclusion`,
            { reason },
            { schema: readinessSchema },
          ),
    reviewChanges,
  );
}
