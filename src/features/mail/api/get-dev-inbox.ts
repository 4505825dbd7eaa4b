import { queryOptions, useQuery, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import {
  devInboxMessageSchema,
  devInboxSchema,
  type DevInbox,
  type DevInboxMessage,
} from '../../../../shared/schemas/dev-inbox';
import { mailKeys } from './mail-keys';

export function getDevInbox(signal?: AbortSignal): Promise<DevInbox> {
  return apiClient.get('/api/dev-inbox?limit=200', { signal, schema: devInboxSchema });
}

export function devInboxQueryOptions() {
  // New mail arrives while the page is open: look again every few seconds.
  return queryOptions({
    queryKey: mailKeys.list({ inbox: 'dev' }),
    queryFn: ({ signal }) => getDevInbox(signal),
    refetchInterval: 4000,
  });
}

export function useDevInbox() {
  return useSuspenseQuery(devInboxQueryOptions()).data;
}

/** Whether the dev inbox exists (a local relay); only asked for roles that may open it. */
export function useDevInboxAvailable(allowed: boolean): boolean {
  const { data } = useQuery({ ...devInboxQueryOptions(), enabled: allowed, refetchInterval: false });
  return data?.enabled ?? false;
}

export function getDevInboxMessage(id: number, signal?: AbortSignal): Promise<DevInboxMessage> {
  return apiClient.get(`/api/dev-inbox/${id}`, { signal, schema: devInboxMessageSchema });
}

export function useDevInboxMessage(id: number | null) {
  return useQuery({
    queryKey: mailKeys.detail(`dev-inbox-${id}`),
    queryFn: ({ signal }) => getDevInboxMessage(id as number, signal),
    enabled: id !== null,
    staleTime: Infinity,
  });
}
