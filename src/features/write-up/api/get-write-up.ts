import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { writeUpOverviewSchema, type WriteUpOverview } from '../../../../shared/schemas/write-ups';
import { writeUpKeys } from './write-up-keys';

export function getWriteUp(roundupId: number, signal?: AbortSignal): Promise<WriteUpOverview> {
  return apiClient.get(`/api/roundups/${roundupId}/write-up`, { signal, schema: writeUpOverviewSchema });
}

export function writeUpQueryOptions(roundupId: number) {
  return queryOptions({
    queryKey: [...writeUpKeys.detail(roundupId), 'overview'],
    queryFn: ({ signal }) => getWriteUp(roundupId, signal),
  });
}

export function useWriteUp(roundupId: number) {
  return useSuspenseQuery(writeUpQueryOptions(roundupId)).data;
}
