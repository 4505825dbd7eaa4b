import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointFieldQueryOptions } from '../../../lib/endpoint-query';
import { createRecord } from '../../../lib/record-requests';
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

export function useCreateBenchProfile() {
  return useChangeMutation(
    createRecord<CreateBenchProfileRequest, BenchProfile>('/api/bench-profiles', benchProfileSchema),
    'benchProfile',
  );
}
