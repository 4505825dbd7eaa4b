import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointQueryOptions } from '../../../lib/endpoint-query';
import { writeUpOverviewSchema } from '../../../../shared/schemas/write-ups';
import { writeUpKeys } from './write-up-keys';

export function writeUpQueryOptions(roundupId: number) {
  return endpointQueryOptions(
    [...writeUpKeys.detail(roundupId), 'overview'],
    `/api/roundups/${roundupId}/write-up`,
    writeUpOverviewSchema,
  );
}

export function useWriteUp(roundupId: number) {
  return useSuspenseQuery(writeUpQueryOptions(roundupId)).data;
}
