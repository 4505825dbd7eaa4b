import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import type { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { sampleListSchema } from '../../../../shared/schemas/samples';
import { sampleKeys } from './sample-keys';

export type SampleList = z.infer<typeof sampleListSchema>;

/** The roundup's sample records, with overdue loans flagged in the roundup's time zone. */
export function getSamples(roundupId: number, signal?: AbortSignal): Promise<SampleList> {
  return apiClient.get(`/api/roundups/${roundupId}/samples`, { signal, schema: sampleListSchema });
}

export function samplesQueryOptions(roundupId: number) {
  return queryOptions({
    queryKey: sampleKeys.list({ roundupId }),
    queryFn: ({ signal }) => getSamples(roundupId, signal),
  });
}

export function useSamples(roundupId: number) {
  return useSuspenseQuery(samplesQueryOptions(roundupId)).data;
}
