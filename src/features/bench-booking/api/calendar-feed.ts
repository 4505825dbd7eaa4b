import { queryOptions, useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateAfter, useChangeMutation } from '../../../lib/stale-after';
import {
  calendarFeedCreatedSchema,
  calendarFeedSchema,
  type CalendarFeed,
  type CalendarFeedCreated,
} from '../../../../shared/schemas/calendar-feed';
import { bookingKeys } from './booking-keys';

export function getCalendarFeed(signal?: AbortSignal): Promise<CalendarFeed> {
  return apiClient.get('/api/account/calendar-feed', { signal, schema: calendarFeedSchema });
}

export function calendarFeedQueryOptions() {
  return queryOptions({
    queryKey: bookingKeys.item('calendar-feed'),
    queryFn: ({ signal }) => getCalendarFeed(signal),
  });
}

export function useCalendarFeed() {
  return useSuspenseQuery(calendarFeedQueryOptions()).data;
}

/** Makes a new secret address (the earlier one stops working); the answer is the only time it is shown. */
export function resetCalendarFeed(): Promise<CalendarFeedCreated> {
  return apiClient.post('/api/account/calendar-feed', undefined, { schema: calendarFeedCreatedSchema });
}

export function disableCalendarFeed(): Promise<void> {
  return apiClient.delete('/api/account/calendar-feed');
}

export function useResetCalendarFeed() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: resetCalendarFeed, onSuccess: () => invalidateAfter(queryClient, 'calendarFeed') });
}

export function useDisableCalendarFeed() {
  return useChangeMutation(disableCalendarFeed, 'calendarFeed');
}
