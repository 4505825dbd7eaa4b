import { useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { endpointFieldQueryOptions } from '../../../lib/endpoint-query';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  benchProfileListSchema,
  benchProfileSchema,
  type BenchProfile,
  type CreateBenchProfileRequest,
} from '../../../../shared/schemas/bench-profiles';
import { roundupKeys } from './roundup-keys';

/** Bench profiles that may be chosen (archived ones are left out). */
export function benchProfilesQueryOptions() {
  return endpointFieldQueryOptions(
    roundupKeys.item('bench-profiles'),
    '/api/bench-profiles',
    benchProfileListSchema,
    'benchProfiles',
  );
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
