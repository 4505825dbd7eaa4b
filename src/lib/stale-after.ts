import { useMutation, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { QueryRoot } from './query-keys';

/**
 * What a change makes stale: for each kind of saved change, the feature caches that show its data. Features do
 * not import each other, so this one map names their roots; the roots are typed from the key factories'
 * `QueryRoot`, so a typo fails the typecheck. Add a page that shows someone else's data → add its root here.
 */
export const staleAfter = {
  /** Benches added, renamed, put in or out of service. Bookings and the bench picker show bench names. */
  bench: ['benches', 'bench-booking'],
  /** A booking made or cancelled: the calendar, the tester's queue ("Bench time") and the tester's dashboard. */
  booking: ['bench-booking', 'my-bench', 'dashboard'],
  /** A bench profile added: roundup forms pick it, benches show the profile they are built to. */
  benchProfile: ['roundups', 'benches'],
  /** A load configuration added: the roundup forms list them. */
  loadConfiguration: ['roundups'],
  /**
   * A roundup's plan changed (created, edited, state, products, configurations), or a matrix cell moved or was
   * assigned: progress, matrix, samples, queues, bookings (they list their cells) and dashboards all move.
   */
  plan: ['roundups', 'matrix', 'samples', 'my-bench', 'bench-booking', 'dashboard', 'editorial'],
  /** A vendor sample's loan changed: the samples table, the roundup's loan column and the dashboard. */
  sample: ['samples', 'roundups', 'dashboard'],
  /** A catalog product or price changed: the catalog and the roundups' product pickers and price checks. */
  product: ['catalog', 'roundups'],
  /** A staff account changed: the users list, the matrix's tester picker. */
  user: ['users', 'matrix'],
  /** The tester's private calendar feed made, reset or turned off. */
  calendarFeed: ['bench-booking'],
  /**
   * A test run recorded, reviewed, re-analysed or made the run of record, or a roundup's rubric changed: the cell's
   * runs, the results, the matrix, the tester's queue and the dashboards.
   */
  run: ['test-runs', 'matrix', 'my-bench', 'roundups', 'dashboard', 'editorial'],
  /** A product's photo added, changed, reordered or removed: the photo pages. */
  photo: ['photos'],
  /** A write-up section saved, moved in review, restored or commented on: the write-up screens. */
  writeUp: ['write-up'],
  /** A verdict set, a chart's settings changed or approved, a cell left out, a roundup sent to review. */
  editorial: ['editorial', 'roundups', 'dashboard'],
  /** The signed-in person's own account (password, sessions). */
  account: ['account'],
} as const satisfies Record<string, readonly QueryRoot[]>;

export type Change = keyof typeof staleAfter;

/** Marks every query that shows data touched by the change (or changes) as stale (active ones refetch at once). */
export function invalidateAfter(queryClient: QueryClient, change: Change | readonly Change[]) {
  const changes: readonly Change[] = typeof change === 'string' ? [change] : change;
  const roots: readonly QueryRoot[] = changes.flatMap((each) => staleAfter[each]);
  return queryClient.invalidateQueries({
    predicate: (query) => roots.includes(query.queryKey[0] as QueryRoot),
  });
}

/** A mutation whose success makes `change` stale: how features send a change and refresh what shows it. */
export function useChangeMutation<Input, Result>(
  mutationFn: (input: Input) => Promise<Result>,
  change: Change | readonly Change[],
) {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn, onSuccess: () => invalidateAfter(queryClient, change) });
}
