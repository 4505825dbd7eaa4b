import { queryOptions, useQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { referenceCandidatesSchema } from '../../../../shared/schemas/roundups';
import { roundupKeys } from './roundup-keys';

export type ReferenceCandidate = z.infer<typeof referenceCandidatesSchema>['candidates'][number];

/** Products with accepted results in earlier roundups: they can be shown here without a retest. */
export async function getReferenceCandidates(id: number, signal?: AbortSignal): Promise<ReferenceCandidate[]> {
  const { candidates } = await apiClient.get(`/api/roundups/${id}/reference-candidates`, {
    signal,
    schema: referenceCandidatesSchema,
  });
  return candidates;
}

export function referenceCandidatesQueryOptions(id: number) {
  return queryOptions({
    queryKey: [...roundupKeys.detail(id), 'reference-candidates'],
    queryFn: ({ signal }) => getReferenceCandidates(id, signal),
  });
}

export function useReferenceCandidates(id: number, enabled: boolean) {
  return useQuery({ ...referenceCandidatesQueryOptions(id), enabled });
}
