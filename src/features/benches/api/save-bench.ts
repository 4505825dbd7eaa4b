import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import {
  benchSchema,
  type Bench,
  type CreateBenchRequest,
  type UpdateBenchRequest,
} from '../../../../shared/schemas/benches';
import { invalidateAfter } from '../../../lib/stale-after';

export function createBench(input: CreateBenchRequest): Promise<Bench> {
  return apiClient.post('/api/benches', input, { schema: benchSchema });
}

export interface UpdateBenchInput {
  id: number;
  changes: UpdateBenchRequest;
}

export function updateBench({ id, changes }: UpdateBenchInput): Promise<Bench> {
  return apiClient.patch(`/api/benches/${id}`, changes, { schema: benchSchema });
}

export function useCreateBench() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBench,
    onSuccess: () => invalidateAfter(queryClient, 'bench'),
  });
}

export function useUpdateBench() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateBench,
    onSuccess: () => invalidateAfter(queryClient, 'bench'),
  });
}
