import { apiClient } from '../../../lib/api-client';
import {
  benchSchema,
  type Bench,
  type CreateBenchRequest,
  type UpdateBenchRequest,
} from '../../../../shared/schemas/benches';
import { useChangeMutation } from '../../../lib/stale-after';

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
  return useChangeMutation(createBench, 'bench');
}

export function useUpdateBench() {
  return useChangeMutation(updateBench, 'bench');
}
