import { useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';
import { roundupChartsSchema, type ChartSettingsInput } from '../../../../shared/schemas/charts';
import { roundupViewQueryOptions } from './roundup-view';

export function chartsQueryOptions(roundupId: number) {
  return roundupViewQueryOptions(roundupId, 'charts', roundupChartsSchema);
}

export function useCharts(roundupId: number) {
  return useSuspenseQuery(chartsQueryOptions(roundupId)).data;
}

export function useChartSettings(roundupId: number) {
  return useChangeMutation(
    ({ key, settings }: { key: string; settings: ChartSettingsInput }) =>
      apiClient.put(`/api/roundups/${roundupId}/charts/${key}/settings`, settings, { schema: roundupChartsSchema }),
    'editorial',
  );
}

export function useApproveChart(roundupId: number) {
  return useChangeMutation(
    ({ key, snapshotHash }: { key: string; snapshotHash: string }) =>
      apiClient.post(
        `/api/roundups/${roundupId}/charts/${key}/approval`,
        { snapshotHash },
        { schema: roundupChartsSchema },
      ),
    'editorial',
  );
}
