import { apiClient } from '../../../lib/api-client';
import {
  benchProfileSchema,
  type BenchProfile,
  type CreateBenchProfileRequest,
} from '../../../../shared/schemas/bench-profiles';
import { useChangeMutation } from '../../../lib/stale-after';

export function createBenchProfile(input: CreateBenchProfileRequest): Promise<BenchProfile> {
  return apiClient.post('/api/bench-profiles', input, { schema: benchProfileSchema });
}

export function useCreateBenchProfile() {
  return useChangeMutation(createBenchProfile, 'benchProfile');
}
