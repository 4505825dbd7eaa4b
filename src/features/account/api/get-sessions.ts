import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointFieldQueryOptions } from '../../../lib/endpoint-query';
import { sessionListSchema } from '../../../../shared/schemas/auth';
import { accountKeys } from './account-keys';

export function sessionsQueryOptions() {
  return endpointFieldQueryOptions(
    accountKeys.item('sessions'),
    '/api/account/sessions',
    sessionListSchema,
    'sessions',
  );
}

export function useSessions() {
  return useSuspenseQuery(sessionsQueryOptions()).data;
}
