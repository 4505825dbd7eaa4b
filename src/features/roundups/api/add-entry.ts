import type { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import { addRoundupEntryResponseSchema, type AddRoundupEntryRequest } from '../../../../shared/schemas/roundups';
import { useChangeMutation } from '../../../lib/stale-after';

export type AddEntryResult = z.infer<typeof addRoundupEntryResponseSchema>;

export interface AddEntryInput {
  roundupId: number;
  entry: AddRoundupEntryRequest;
}

/** Adds a catalog product; the answer carries the price-band warnings to show the editor. */
export function addEntry({ roundupId, entry }: AddEntryInput): Promise<AddEntryResult> {
  return apiClient.post(`/api/roundups/${roundupId}/entries`, entry, { schema: addRoundupEntryResponseSchema });
}

export function useAddEntry() {
  return useChangeMutation(addEntry, 'plan');
}
