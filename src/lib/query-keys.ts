/**
 * Hierarchical query keys for one feature: `[feature]`, `[feature, 'list', filters]`, `[feature, 'detail', id]`.
 * Invalidating `keys.all` refreshes everything the feature has cached.
 */
export function createQueryKeys<const Feature extends string>(feature: Feature) {
  return {
    all: [feature] as const,
    lists: () => [feature, 'list'] as const,
    list: (filters: Record<string, unknown> = {}) => [feature, 'list', filters] as const,
    details: () => [feature, 'detail'] as const,
    detail: (id: string | number) => [feature, 'detail', id] as const,
    item: (name: string) => [feature, name] as const,
  };
}
