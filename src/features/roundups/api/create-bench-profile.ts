import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import {
  benchProfileSchema,
  type BenchProfile,
  type CreateBenchProfileRequest,
} from '../../../../shared/schemas/bench-profiles';
import { invalidateAfter } from '../../../lib/stale-after';

export function createBenchProfile(input: CreateBenchProfileRequest): Promise<BenchProfile> {
  return apiClient.post('/api/bench-profiles', input, { schema: benchProfileSchema });
}

export function useCreateBenchProfile() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBenchProfile,
    onSuccess: () => invalidateAfter(queryClient, 'benchProfile'),
  });
}
