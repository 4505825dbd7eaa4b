import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointQueryOptions } from '../../../lib/endpoint-query';
import { sampleListSchema } from '../../../../shared/schemas/samples';
import { sampleKeys } from './sample-keys';

/** The roundup's sample records, with overdue loans flagged in the roundup's time zone. */
export function samplesQueryOptions(roundupId: number) {
  return endpointQueryOptions(sampleKeys.list({ roundupId }), `/api/roundups/${roundupId}/samples`, sampleListSchema);
}

export function useSamples(roundupId: number) {
  return useSuspenseQuery(samplesQueryOptions(roundupId)).data;
}
