import { apiClient } from '../../../lib/api-client';
import { sampleSchema, type Sample, type UpdateSampleRequest } from '../../../../shared/schemas/samples';
import { useChangeMutation } from '../../../lib/stale-after';

export interface UpdateSampleInput {
  roundupId: number;
  sampleId: number;
  changes: UpdateSampleRequest;
}

/** Saves a sample record; the server checks the whole record (a loan needs a return-by date, and so on). */
export function updateSample({ roundupId, sampleId, changes }: UpdateSampleInput): Promise<Sample> {
  return apiClient.patch(`/api/roundups/${roundupId}/samples/${sampleId}`, changes, { schema: sampleSchema });
}

export function useUpdateSample() {
  return useChangeMutation(updateSample, 'sample');
}
