import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointQueryOptions } from '../../../lib/endpoint-query';
import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  calendarFeedCreatedSchema,
  calendarFeedSchema,
  type CalendarFeedCreated,
} from '../../../../shared/schemas/calendar-feed';
import { bookingKeys } from './booking-keys';

export function calendarFeedQueryOptions() {
  return endpointQueryOptions(bookingKeys.item('calendar-feed'), '/api/account/calendar-feed', calendarFeedSchema);
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
  return useChangeMutation(resetCalendarFeed, 'calendarFeed');
}

export function useDisableCalendarFeed() {
  return useChangeMutation(disableCalendarFeed, 'calendarFeed');
}
