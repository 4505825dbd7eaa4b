import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointQueryOptions } from '../../../lib/endpoint-query';
import { roundupMatrixSchema } from '../../../../shared/schemas/matrix';
import { matrixKeys } from './matrix-keys';

export function matrixQueryOptions(roundupId: number) {
  return endpointQueryOptions(matrixKeys.detail(roundupId), `/api/roundups/${roundupId}/matrix`, roundupMatrixSchema);
}

export function useMatrix(roundupId: number) {
  return useSuspenseQuery(matrixQueryOptions(roundupId)).data;
}
