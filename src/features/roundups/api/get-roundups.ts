import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointFieldQueryOptions } from '../../../lib/endpoint-query';
import { roundupListSchema } from '../../../../shared/schemas/roundups';
import { roundupKeys } from './roundup-keys';

export function roundupsQueryOptions() {
  return endpointFieldQueryOptions(roundupKeys.list(), '/api/roundups', roundupListSchema, 'roundups');
}

export function useRoundups() {
  return useSuspenseQuery(roundupsQueryOptions()).data;
}
