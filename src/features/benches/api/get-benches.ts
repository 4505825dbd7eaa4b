import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointFieldQueryOptions } from '../../../lib/endpoint-query';
import { benchListSchema } from '../../../../shared/schemas/benches';
import { benchKeys } from './bench-keys';

/** The physical test systems (in and out of service): the Benches page and every bench picker. */
export function benchesQueryOptions() {
  return endpointFieldQueryOptions(benchKeys.list(), '/api/benches', benchListSchema, 'benches');
}

export function useBenches() {
  return useSuspenseQuery(benchesQueryOptions()).data;
}
