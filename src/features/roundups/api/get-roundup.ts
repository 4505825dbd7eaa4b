import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointQueryOptions } from '../../../lib/endpoint-query';
import { roundupDetailSchema } from '../../../../shared/schemas/roundups';
import { roundupKeys } from './roundup-keys';

export function roundupQueryOptions(id: number) {
  return endpointQueryOptions(roundupKeys.detail(id), `/api/roundups/${id}`, roundupDetailSchema);
}

export function useRoundup(id: number) {
  return useSuspenseQuery(roundupQueryOptions(id)).data;
}
