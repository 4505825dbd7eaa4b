import { queryOptions, useMutation, useQuery, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { z } from 'zod';
import { apiClient } from '../../../lib/api-client';
import {
  mailCategorySchema,
  mailPreferencesSchema,
  roundupMailingsSchema,
  staffMailCategoryListSchema,
  type MailCategoryInput,
  type MailPreferences,
  type StaffMailKind,
} from '../../../../shared/schemas/subscribers';
import { mailKeys } from './mail-keys';

export function subscriberCategoriesQueryOptions() {
  return queryOptions({
    queryKey: mailKeys.item('subscriber-categories'),
    queryFn: ({ signal }) =>
      apiClient.get('/api/subscriber-categories', { signal, schema: staffMailCategoryListSchema }),
  });
}

export function useSubscriberCategories() {
  return useSuspenseQuery(subscriberCategoriesQueryOptions()).data;
}

export function useSaveCategory() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number | null; input: MailCategoryInput }) =>
      id === null
        ? apiClient.post('/api/subscriber-categories', input, { schema: mailCategorySchema })
        : apiClient.patch(`/api/subscriber-categories/${id}`, input, { schema: mailCategorySchema }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: mailKeys.all }),
  });
}

export function useDeleteCategory() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => apiClient.delete(`/api/subscriber-categories/${id}`),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: mailKeys.all }),
  });
}

/** A roundup's mailings with their counts; refreshed every few seconds while any is still going out. */
export function useRoundupMailings(roundupId: number) {
  return useQuery({
    queryKey: mailKeys.detail(`roundup-${roundupId}`),
    queryFn: ({ signal }) =>
      apiClient.get(`/api/roundups/${roundupId}/mailings`, { signal, schema: roundupMailingsSchema }),
    refetchInterval: (query) =>
      query.state.data?.mailings.some((m) => m.counts.queued + m.counts.sending + m.counts.deferred > 0) ? 2000 : false,
  });
}

export function useSendTestMail(roundupId: number) {
  return useMutation({
    mutationFn: () =>
      apiClient.post(`/api/roundups/${roundupId}/mailings/test`, undefined, {
        schema: z.object({ sentTo: z.string() }),
      }),
  });
}

export function useCreateMailing(roundupId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { kind: 'update' | 'correction'; note: string }) =>
      apiClient.post(`/api/roundups/${roundupId}/mailings`, input, { schema: roundupMailingsSchema }),
    onSuccess: (data) => queryClient.setQueryData(mailKeys.detail(`roundup-${roundupId}`), data),
  });
}

export function mailPreferencesQueryOptions() {
  return queryOptions({
    queryKey: mailKeys.item('preferences'),
    queryFn: ({ signal }) => apiClient.get('/api/account/mail', { signal, schema: mailPreferencesSchema }),
  });
}

export function useMailPreferences() {
  return useQuery(mailPreferencesQueryOptions());
}

export function useUpdateMailPreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (disabled: StaffMailKind[]) =>
      apiClient.put('/api/account/mail', { disabled }, { schema: mailPreferencesSchema }),
    onSuccess: (data: MailPreferences) => queryClient.setQueryData(mailKeys.item('preferences'), data),
  });
}
