import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';

export interface RemoveEntryInput {
  roundupId: number;
  entryId: number;
}

/** Removes a product with its cells and sample; refused (409) once one of its cells has work. */
export function removeEntry({ roundupId, entryId }: RemoveEntryInput): Promise<void> {
  return apiClient.delete(`/api/roundups/${roundupId}/entries/${entryId}`);
}

export function useRemoveEntry() {
  return useChangeMutation(removeEntry, 'plan');
}
