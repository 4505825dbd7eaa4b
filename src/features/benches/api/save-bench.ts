import { createRecord, editRecord } from '../../../lib/record-requests';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  benchSchema,
  type Bench,
  type CreateBenchRequest,
  type UpdateBenchRequest,
} from '../../../../shared/schemas/benches';

export function useCreateBench() {
  return useChangeMutation(createRecord<CreateBenchRequest, Bench>('/api/benches', benchSchema), 'bench');
}

export function useUpdateBench() {
  return useChangeMutation(editRecord<UpdateBenchRequest, Bench>('/api/benches', benchSchema), 'bench');
}
