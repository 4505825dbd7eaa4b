import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { sampleSchema, type Sample, type UpdateSampleRequest } from '../../../../shared/schemas/samples';
import { invalidateAfter } from '../../../lib/stale-after';

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
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updateSample, onSuccess: () => invalidateAfter(queryClient, 'sample') });
}
