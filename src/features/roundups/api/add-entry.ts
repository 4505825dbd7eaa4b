import { apiClient } from '../../../lib/api-client';
import { addRoundupEntryResponseSchema, type AddRoundupEntryRequest } from '../../../../shared/schemas/roundups';
import { useChangeMutation } from '../../../lib/stale-after';

/** Adds a catalog product; the answer carries the price-band warnings to show the editor. */
export function useAddEntry() {
  return useChangeMutation(
    ({ roundupId, entry }: { roundupId: number; entry: AddRoundupEntryRequest }) =>
      apiClient.post(`/api/roundups/${roundupId}/entries`, entry, { schema: addRoundupEntryResponseSchema }),
    'plan',
  );
}
