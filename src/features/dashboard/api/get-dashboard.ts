import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointQueryOptions } from '../../../lib/endpoint-query';
import { createQueryKeys } from '../../../lib/query-keys';
import { dashboardSchema } from '../../../../shared/schemas/dashboard';

export const dashboardKeys = createQueryKeys('dashboard');

/** The home page for the signed-in role: editor, tester, or an overview for writers and admins. */
export function dashboardQueryOptions() {
  return endpointQueryOptions(dashboardKeys.item('home'), '/api/dashboard', dashboardSchema);
}

export function useDashboard() {
  return useSuspenseQuery(dashboardQueryOptions()).data;
}
