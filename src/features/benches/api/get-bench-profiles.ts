import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { benchProfileListSchema } from '../../../../shared/schemas/bench-profiles';
import { benchKeys } from './bench-keys';

export interface BenchProfileOption {
  id: number;
  name: string;
}

/** Bench profiles a bench can be built to, for the bench form's picker (archived ones left out). */
export async function getBenchProfileOptions(signal?: AbortSignal): Promise<BenchProfileOption[]> {
  const { benchProfiles } = await apiClient.get('/api/bench-profiles', { signal, schema: benchProfileListSchema });
  return benchProfiles.map(({ id, name }) => ({ id, name }));
}

export function benchProfileOptionsQueryOptions() {
  return queryOptions({
    queryKey: benchKeys.item('profile-options'),
    queryFn: ({ signal }) => getBenchProfileOptions(signal),
  });
}

export function useBenchProfileOptions() {
  return useSuspenseQuery(benchProfileOptionsQueryOptions()).data;
}
