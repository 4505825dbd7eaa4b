import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointQueryOptions } from '../../../lib/endpoint-query';
import { myBenchSchema } from '../../../../shared/schemas/benches';
import { myBenchKeys } from './my-bench-keys';

/** The signed-in tester's queue (by due date), recorded cells awaiting the editor, and upcoming bookings. */
export function myBenchQueryOptions() {
  return endpointQueryOptions(myBenchKeys.item('overview'), '/api/my-bench', myBenchSchema);
}

export function useMyBench() {
  return useSuspenseQuery(myBenchQueryOptions()).data;
}
