import type { QueryClient } from '@tanstack/react-query';
import { createQueryKeys } from '../../../lib/query-keys';

export const roundupKeys = createQueryKeys('roundups');

// A plan change moves numbers on other pages too (progress, queues, the dashboard). Features do not import each
// other, so the roots are named here by their plain strings.
const planningRoots = new Set(['roundups', 'matrix', 'samples', 'my-bench', 'dashboard']);

/** Refreshes every planning query after a change to a roundup's plan. */
export function invalidatePlanning(queryClient: QueryClient) {
  return queryClient.invalidateQueries({ predicate: (query) => planningRoots.has(String(query.queryKey[0])) });
}
