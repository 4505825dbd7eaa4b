import { useQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import { endpointFieldQueryOptions } from '../../../lib/endpoint-query';
import { referenceCandidatesSchema } from '../../../../shared/schemas/roundups';
import { roundupKeys } from './roundup-keys';

export type ReferenceCandidate = z.infer<typeof referenceCandidatesSchema>['candidates'][number];

/** Products with accepted results in earlier roundups: they can be shown here without a retest. */
export function referenceCandidatesQueryOptions(id: number) {
  return endpointFieldQueryOptions(
    [...roundupKeys.detail(id), 'reference-candidates'],
    `/api/roundups/${id}/reference-candidates`,
    referenceCandidatesSchema,
    'candidates',
  );
}

export function useReferenceCandidates(id: number, enabled: boolean) {
  return useQuery({ ...referenceCandidatesQueryOptions(id), enabled });
}
