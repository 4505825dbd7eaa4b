import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { benchListSchema, type Bench } from '../../../../shared/schemas/benches';
import { benchKeys } from './bench-keys';

/** The physical test systems (in and out of service): the Benches page and every bench picker. */
export async function getBenches(signal?: AbortSignal): Promise<Bench[]> {
  const { benches } = await apiClient.get('/api/benches', { signal, schema: benchListSchema });
  return benches;
}

export function benchesQueryOptions() {
  return queryOptions({ queryKey: benchKeys.list(), queryFn: ({ signal }) => getBenches(signal) });
}

export function useBenches() {
  return useSuspenseQuery(benchesQueryOptions()).data;
}
