import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { roundupMatrixSchema, type RoundupMatrix } from '../../../../shared/schemas/matrix';
import { matrixKeys } from './matrix-keys';

export function getMatrix(roundupId: number, signal?: AbortSignal): Promise<RoundupMatrix> {
  return apiClient.get(`/api/roundups/${roundupId}/matrix`, { signal, schema: roundupMatrixSchema });
}

export function matrixQueryOptions(roundupId: number) {
  return queryOptions({
    queryKey: matrixKeys.detail(roundupId),
    queryFn: ({ signal }) => getMatrix(roundupId, signal),
  });
}

export function useMatrix(roundupId: number) {
  return useSuspenseQuery(matrixQueryOptions(roundupId)).data;
}
