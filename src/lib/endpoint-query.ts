import { queryOptions, type QueryKey } from '@tanstack/react-query';
import type { z } from 'zod';
import { apiClient } from './api-client';

/** The query options of one GET endpoint: its cache key, and its answer read through the endpoint's schema. */
export function endpointQueryOptions<T, const Key extends QueryKey>(queryKey: Key, path: string, schema: z.ZodType<T>) {
  return queryOptions({ queryKey, queryFn: ({ signal }) => apiClient.get(path, { signal, schema }) });
}

/**
 * The same for an endpoint that wraps what it lists in one named field (`{ benches: [...] }`): the cache holds the
 * field's value, read through the endpoint's schema.
 */
export function endpointFieldQueryOptions<T, const Field extends keyof T, const Key extends QueryKey>(
  queryKey: Key,
  path: string,
  schema: z.ZodType<T>,
  field: Field,
) {
  return queryOptions({
    queryKey,
    queryFn: async ({ signal }): Promise<T[Field]> => (await apiClient.get(path, { signal, schema }))[field],
  });
}
