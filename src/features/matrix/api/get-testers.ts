import { useQuery } from '@tanstack/react-query';
import { endpointFieldQueryOptions } from '../../../lib/endpoint-query';
import { testerListSchema } from '../../../../shared/schemas/matrix';
import { matrixKeys } from './matrix-keys';

/** Active bench testers, to assign cells to (editors only). */
export function testersQueryOptions() {
  return endpointFieldQueryOptions(matrixKeys.item('testers'), '/api/testers', testerListSchema, 'testers');
}

export function useTesters(enabled: boolean) {
  return useQuery({ ...testersQueryOptions(), enabled });
}
