import type { QueryClient } from '@tanstack/react-query';

// A change to a plan, a cell, a sample or a booked run moves numbers on other pages too (progress, queues, the
// dashboard). Features do not import each other, so their query roots are named here by their plain strings.
const planningRoots = new Set(['roundups', 'matrix', 'samples', 'my-bench', 'dashboard']);

/** Refreshes every planning query after a change to planning data. */
export function invalidatePlanning(queryClient: QueryClient) {
  return queryClient.invalidateQueries({ predicate: (query) => planningRoots.has(String(query.queryKey[0])) });
}
