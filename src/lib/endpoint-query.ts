import { queryOptions, type QueryKey } from '@tanstack/react-query';
import type { z } from 'zod';
import { apiClient } from './api-client';

/** The query options of one GET endpoint: its cache key, and its answer read through the endpoint's schema. */
export function endpointQueryOptions<T, const Key extends QueryKey>(queryKey: Key, path: string, schema: z.ZodType<T>) {
  return queryOptions({ queryKey, queryFn: ({ signal }) => apiClient.get(path, { signal, schema }) });
}
