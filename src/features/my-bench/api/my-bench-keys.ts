import type { QueryClient } from '@tanstack/react-query';
import { createQueryKeys } from '../../../lib/query-keys';

export const myBenchKeys = createQueryKeys('my-bench');

// A run started or a slot booked here shows on the matrix and the dashboard too. Features do not import each
// other, so the other planning roots are named here by their plain strings.
const planningRoots = new Set(['roundups', 'matrix', 'samples', 'my-bench', 'dashboard']);

export function invalidatePlanning(queryClient: QueryClient) {
  return queryClient.invalidateQueries({ predicate: (query) => planningRoots.has(String(query.queryKey[0])) });
}
