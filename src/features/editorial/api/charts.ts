import { queryOptions, useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient, apiRequest } from '../../../lib/api-client';
import { invalidateAfter } from '../../../lib/stale-after';
import { roundupChartsSchema, type ChartSettingsInput, type RoundupCharts } from '../../../../shared/schemas/charts';
import { editorialKeys } from './editorial-keys';

export function getCharts(roundupId: number, signal?: AbortSignal): Promise<RoundupCharts> {
  return apiClient.get(`/api/roundups/${roundupId}/charts`, { signal, schema: roundupChartsSchema });
}

export function chartsQueryOptions(roundupId: number) {
  return queryOptions({
    queryKey: [...editorialKeys.detail(roundupId), 'charts'],
    queryFn: ({ signal }) => getCharts(roundupId, signal),
  });
}

export function useCharts(roundupId: number) {
  return useSuspenseQuery(chartsQueryOptions(roundupId)).data;
}

export function useChartSettings(roundupId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ key, settings }: { key: string; settings: ChartSettingsInput }) =>
      apiRequest(`/api/roundups/${roundupId}/charts/${key}/settings`, {
        method: 'PUT',
        body: settings,
        schema: roundupChartsSchema,
      }),
    onSuccess: () => invalidateAfter(queryClient, 'editorial'),
  });
}

export function useApproveChart(roundupId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ key, snapshotHash }: { key: string; snapshotHash: string }) =>
      apiClient.post(
        `/api/roundups/${roundupId}/charts/${key}/approval`,
        { snapshotHash },
        { schema: roundupChartsSchema },
      ),
    onSuccess: () => invalidateAfter(queryClient, 'editorial'),
  });
}
