import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { testerListSchema } from '../../../../shared/schemas/matrix';
import type { PersonRef } from '../../../../shared/schemas/planning-fields';
import { matrixKeys } from './matrix-keys';

/** Active bench testers, to assign cells to (editors only). */
export async function getTesters(signal?: AbortSignal): Promise<PersonRef[]> {
  const { testers } = await apiClient.get('/api/testers', { signal, schema: testerListSchema });
  return testers;
}

export function testersQueryOptions() {
  return queryOptions({ queryKey: matrixKeys.item('testers'), queryFn: ({ signal }) => getTesters(signal) });
}

export function useTesters(enabled: boolean) {
  return useQuery({ ...testersQueryOptions(), enabled });
}
