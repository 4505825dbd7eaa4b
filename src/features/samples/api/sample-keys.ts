import type { QueryClient } from '@tanstack/react-query';
import { createQueryKeys } from '../../../lib/query-keys';

export const sampleKeys = createQueryKeys('samples');

// A sample's status shows on the roundup, its entries and the dashboard's overdue loans. Features do not import
// each other, so the other planning roots are named here by their plain strings.
const planningRoots = new Set(['roundups', 'matrix', 'samples', 'my-bench', 'dashboard']);

export function invalidatePlanning(queryClient: QueryClient) {
  return queryClient.invalidateQueries({ predicate: (query) => planningRoots.has(String(query.queryKey[0])) });
}
