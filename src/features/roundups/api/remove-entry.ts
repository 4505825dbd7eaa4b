import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';

/** Removes a product with its cells and sample; refused (409) once one of its cells has work. */
export function useRemoveEntry() {
  return useChangeMutation(
    ({ roundupId, entryId }: { roundupId: number; entryId: number }): Promise<void> =>
      apiClient.delete(`/api/roundups/${roundupId}/entries/${entryId}`),
    'plan',
  );
}
