import { queryOptions, useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient, apiRequest } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  openDataSettingsSchema,
  previewLinkSchema,
  roundupPublishingSchema,
  type OpenDataSettingsRequest,
  type RoundupPublishing,
  type ScheduleRoundupRequest,
} from '../../../../shared/schemas/publishing';
import { roundupKeys } from './roundup-keys';

export function getPublishing(id: number, signal?: AbortSignal): Promise<RoundupPublishing> {
  return apiClient.get(`/api/roundups/${id}/publishing`, { signal, schema: roundupPublishingSchema });
}

export function publishingQueryOptions(id: number) {
  return queryOptions({
    queryKey: [...roundupKeys.detail(id), 'publishing'] as const,
    queryFn: ({ signal }) => getPublishing(id, signal),
    // A scheduled roundup goes live by itself: look again now and then while the page is open.
    refetchInterval: (query) => (query.state.data?.state === 'scheduled' ? 2_000 : false),
  });
}

export function usePublishing(id: number) {
  return useSuspenseQuery(publishingQueryOptions(id)).data;
}

function useRoundupChange<I>(mutationFn: (input: I) => Promise<unknown>) {
  return useChangeMutation(mutationFn, 'plan');
}

export function useScheduleRoundup() {
  return useRoundupChange(({ id, schedule }: { id: number; schedule: ScheduleRoundupRequest }) =>
    apiRequest(`/api/roundups/${id}/schedule`, { method: 'PUT', body: schedule, schema: roundupPublishingSchema }),
  );
}

export function useUnscheduleRoundup() {
  return useRoundupChange((id: number) =>
    apiClient.delete(`/api/roundups/${id}/schedule`, { schema: roundupPublishingSchema }),
  );
}

export function usePublishUpdate() {
  return useRoundupChange(({ id, kind, note }: { id: number; kind: 'update' | 'correction'; note: string }) =>
    apiClient.post(`/api/roundups/${id}/publication-updates`, { kind, note }, { schema: roundupPublishingSchema }),
  );
}

export function useCreatePreviewLink() {
  return useMutation({
    mutationFn: ({ id, hours }: { id: number; hours: number }) =>
      apiClient.post(`/api/roundups/${id}/preview-links`, { hours }, { schema: previewLinkSchema }),
  });
}

export function openDataQueryOptions(id: number) {
  return queryOptions({
    queryKey: [...roundupKeys.detail(id), 'open-data'] as const,
    queryFn: ({ signal }) => apiClient.get(`/api/roundups/${id}/open-data`, { signal, schema: openDataSettingsSchema }),
  });
}

export function useOpenDataSettings(id: number) {
  return useSuspenseQuery(openDataQueryOptions(id)).data;
}

export function useSetOpenDataSettings() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, settings }: { id: number; settings: OpenDataSettingsRequest }) =>
      apiRequest(`/api/roundups/${id}/open-data`, { method: 'PUT', body: settings, schema: openDataSettingsSchema }),
    onSuccess: (saved) => queryClient.setQueryData(openDataQueryOptions(saved.roundupId).queryKey, saved),
  });
}
