import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookableStates } from '../../../../shared/domain/planning/matrix-cell-states';
import { myBenchSchema } from '../../../../shared/schemas/benches';
import type { QueueItem } from '../../../../shared/schemas/matrix';
import { benchKeys } from './bench-keys';

/** The signed-in tester's assigned cells that bench time can still be booked for (from their queue). */
export async function getBookableCells(signal?: AbortSignal): Promise<QueueItem[]> {
  const { queue } = await apiClient.get('/api/my-bench', { signal, schema: myBenchSchema });
  return queue.filter((item) => bookableStates.includes(item.cell.state));
}

export function bookableCellsQueryOptions() {
  return queryOptions({
    queryKey: benchKeys.item('bookable-cells'),
    queryFn: ({ signal }) => getBookableCells(signal),
  });
}

export function useBookableCells() {
  return useSuspenseQuery(bookableCellsQueryOptions()).data;
}
