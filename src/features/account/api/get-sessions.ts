import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { sessionListSchema, type SessionInfo } from '../../../../shared/schemas/auth';
import { accountKeys } from './account-keys';

export async function getSessions(signal?: AbortSignal): Promise<SessionInfo[]> {
  const { sessions } = await apiClient.get('/api/account/sessions', { signal, schema: sessionListSchema });
  return sessions;
}

export function sessionsQueryOptions() {
  return queryOptions({ queryKey: accountKeys.item('sessions'), queryFn: ({ signal }) => getSessions(signal) });
}

export function useSessions() {
  return useSuspenseQuery(sessionsQueryOptions()).data;
}
