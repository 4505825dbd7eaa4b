import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  benchProfileListSchema,
  benchProfileSchema,
  type BenchProfile,
  type CreateBenchProfileRequest,
} from '../../../../shared/schemas/bench-profiles';
import { roundupKeys } from './roundup-keys';

/** Bench profiles that may be chosen (archived ones are left out). */
export async function getBenchProfiles(signal?: AbortSignal): Promise<BenchProfile[]> {
  const { benchProfiles } = await apiClient.get('/api/bench-profiles', { signal, schema: benchProfileListSchema });
  return benchProfiles;
}

export function benchProfilesQueryOptions() {
  return queryOptions({
    queryKey: roundupKeys.item('bench-profiles'),
    queryFn: ({ signal }) => getBenchProfiles(signal),
  });
}

export function useBenchProfiles() {
  return useSuspenseQuery(benchProfilesQueryOptions()).data;
}

export function createBenchProfile(input: CreateBenchProfileRequest): Promise<BenchProfile> {
  return apiClient.post('/api/bench-profiles', input, { schema: benchProfileSchema });
}

export function useCreateBenchProfile() {
  return useChangeMutation(createBenchProfile, 'benchProfile');
}
