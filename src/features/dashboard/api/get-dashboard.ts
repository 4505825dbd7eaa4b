import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { createQueryKeys } from '../../../lib/query-keys';
import { dashboardSchema, type Dashboard } from '../../../../shared/schemas/dashboard';

export const dashboardKeys = createQueryKeys('dashboard');

/** The home page for the signed-in role: editor, tester, or an overview for writers and admins. */
export function getDashboard(signal?: AbortSignal): Promise<Dashboard> {
  return apiClient.get('/api/dashboard', { signal, schema: dashboardSchema });
}

export function dashboardQueryOptions() {
  return queryOptions({ queryKey: dashboardKeys.item('home'), queryFn: ({ signal }) => getDashboard(signal) });
}

export function useDashboard() {
  return useSuspenseQuery(dashboardQueryOptions()).data;
}
