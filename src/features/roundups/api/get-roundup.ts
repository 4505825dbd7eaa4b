import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { roundupDetailSchema, type RoundupDetail } from '../../../../shared/schemas/roundups';
import { roundupKeys } from './roundup-keys';

export function getRoundup(id: number, signal?: AbortSignal): Promise<RoundupDetail> {
  return apiClient.get(`/api/roundups/${id}`, { signal, schema: roundupDetailSchema });
}

export function roundupQueryOptions(id: number) {
  return queryOptions({ queryKey: roundupKeys.detail(id), queryFn: ({ signal }) => getRoundup(id, signal) });
}

export function useRoundup(id: number) {
  return useSuspenseQuery(roundupQueryOptions(id)).data;
}
