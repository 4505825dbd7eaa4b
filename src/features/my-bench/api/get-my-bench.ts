import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { myBenchSchema, type MyBench } from '../../../../shared/schemas/benches';
import { myBenchKeys } from './my-bench-keys';

/** The signed-in tester's queue (by due date), recorded cells awaiting the editor, and upcoming bookings. */
export function getMyBench(signal?: AbortSignal): Promise<MyBench> {
  return apiClient.get('/api/my-bench', { signal, schema: myBenchSchema });
}

export function myBenchQueryOptions() {
  return queryOptions({ queryKey: myBenchKeys.item('overview'), queryFn: ({ signal }) => getMyBench(signal) });
}

export function useMyBench() {
  return useSuspenseQuery(myBenchQueryOptions()).data;
}
