import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { roundupListSchema, type RoundupSummary } from '../../../../shared/schemas/roundups';
import { roundupKeys } from './roundup-keys';

export async function getRoundups(signal?: AbortSignal): Promise<RoundupSummary[]> {
  const { roundups } = await apiClient.get('/api/roundups', { signal, schema: roundupListSchema });
  return roundups;
}

export function roundupsQueryOptions() {
  return queryOptions({ queryKey: roundupKeys.list(), queryFn: ({ signal }) => getRoundups(signal) });
}

export function useRoundups() {
  return useSuspenseQuery(roundupsQueryOptions()).data;
}
