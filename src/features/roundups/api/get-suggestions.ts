import { useQuery } from '@tanstack/react-query';
import { endpointQueryOptions } from '../../../lib/endpoint-query';
import { roundupSuggestionsSchema } from '../../../../shared/schemas/roundups';
import { roundupKeys } from './roundup-keys';

/** Catalog products of the roundup's platform whose latest price in the band's region is inside the band. */
export function suggestionsQueryOptions(id: number) {
  return endpointQueryOptions(
    [...roundupKeys.detail(id), 'suggestions'],
    `/api/roundups/${id}/suggestions`,
    roundupSuggestionsSchema,
  );
}

/** Loaded only for editors, when they open the add-products panel. */
export function useSuggestions(id: number, enabled: boolean) {
  return useQuery({ ...suggestionsQueryOptions(id), enabled });
}
