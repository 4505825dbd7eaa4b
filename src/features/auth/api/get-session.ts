import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient, isApiError } from '../../../lib/api-client';
import { sessionResponseSchema, type CurrentUser } from '../../../../shared/schemas/auth';
import { sessionKey } from './auth-keys';

/** The signed-in user, or null when nobody is signed in (the server answers 401). */
export async function getSession(signal?: AbortSignal): Promise<CurrentUser | null> {
  try {
    const { user } = await apiClient.get('/api/auth/session', { signal, schema: sessionResponseSchema });
    return user;
  } catch (error) {
    if (isApiError(error) && error.status === 401) return null;
    throw error;
  }
}

export function sessionQueryOptions() {
  return queryOptions({
    queryKey: sessionKey,
    queryFn: ({ signal }) => getSession(signal),
    staleTime: 5 * 60_000,
  });
}

export function useSession() {
  return useSuspenseQuery(sessionQueryOptions()).data;
}
