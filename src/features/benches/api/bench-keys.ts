import type { QueryClient } from '@tanstack/react-query';
import { createQueryKeys } from '../../../lib/query-keys';

export const benchKeys = createQueryKeys('benches');

// A booking also shows on the tester's My bench page and the dashboard. Features do not import each other, so
// those roots are named here by their plain strings.
const bookingRoots = new Set(['benches', 'my-bench', 'dashboard']);

export function invalidateBookings(queryClient: QueryClient) {
  return queryClient.invalidateQueries({ predicate: (query) => bookingRoots.has(String(query.queryKey[0])) });
}
