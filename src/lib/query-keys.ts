/**
 * Every feature's cache root. A feature makes its key factory from its own root, and the staleness map
 * (`stale-after.ts`) names roots from this list, so a misspelt root fails the typecheck instead of silently
 * leaving a page stale.
 */
export const queryRoots = [
  'account',
  'auth',
  'bench-booking',
  'benches',
  'catalog',
  'dashboard',
  'editorial',
  'log-check',
  'mail',
  'matrix',
  'my-bench',
  'photos',
  'roundups',
  'samples',
  'test-runs',
  'users',
  'write-up',
] as const;
export type QueryRoot = (typeof queryRoots)[number];

/**
 * Hierarchical query keys for one feature: `[feature]`, `[feature, 'list', filters]`, `[feature, 'detail', id]`.
 * Invalidating `keys.all` refreshes everything the feature has cached.
 */
export function createQueryKeys<const Feature extends QueryRoot>(feature: Feature) {
  return {
    all: [feature] as const,
    lists: () => [feature, 'list'] as const,
    list: (filters: Record<string, unknown> = {}) => [feature, 'list', filters] as const,
    details: () => [feature, 'detail'] as const,
    detail: (id: string | number) => [feature, 'detail', id] as const,
    item: (name: string) => [feature, name] as const,
  };
}
