import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { roundupSuggestionsSchema, type RoundupSuggestions } from '../../../../shared/schemas/roundups';
import { roundupKeys } from './roundup-keys';

/** Catalog products of the roundup's platform whose latest price in the band's region is inside the band. */
export function getSuggestions(id: number, signal?: AbortSignal): Promise<RoundupSuggestions> {
  return apiClient.get(`/api/roundups/${id}/suggestions`, { signal, schema: roundupSuggestionsSchema });
}

export function suggestionsQueryOptions(id: number) {
  return queryOptions({
    queryKey: [...roundupKeys.detail(id), 'suggestions'],
    queryFn: ({ signal }) => getSuggestions(id, signal),
  });
}

/** Loaded only for editors, when they open the add-products panel. */
export function useSuggestions(id: number, enabled: boolean) {
  return useQuery({ ...suggestionsQueryOptions(id), enabled });
}
