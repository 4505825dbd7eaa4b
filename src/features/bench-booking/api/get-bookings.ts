import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingListSchema, type Booking } from '../../../../shared/schemas/benches';
import { bookingKeys } from './booking-keys';

export interface BookingWindow {
  /** ISO instants; bookings overlapping [from, to) are listed. */
  from: string;
  to: string;
}

export async function getBookings(window: BookingWindow, signal?: AbortSignal): Promise<Booking[]> {
  const params = new URLSearchParams({ from: window.from, to: window.to });
  const { bookings } = await apiClient.get(`/api/bookings?${params}`, { signal, schema: bookingListSchema });
  return bookings;
}

export function bookingsQueryOptions(window: BookingWindow) {
  return queryOptions({
    queryKey: bookingKeys.list({ from: window.from, to: window.to }),
    queryFn: ({ signal }) => getBookings(window, signal),
  });
}

export function useBookings(window: BookingWindow) {
  return useSuspenseQuery(bookingsQueryOptions(window)).data;
}
