import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointFieldQueryOptions } from '../../../lib/endpoint-query';
import { bookingListSchema } from '../../../../shared/schemas/benches';
import { bookingKeys } from './booking-keys';

export interface BookingWindow {
  /** ISO instants; bookings overlapping [from, to) are listed. */
  from: string;
  to: string;
}

export function bookingsQueryOptions(window: BookingWindow) {
  const params = new URLSearchParams({ from: window.from, to: window.to });
  return endpointFieldQueryOptions(
    bookingKeys.list({ from: window.from, to: window.to }),
    `/api/bookings?${params}`,
    bookingListSchema,
    'bookings',
  );
}

export function useBookings(window: BookingWindow) {
  return useSuspenseQuery(bookingsQueryOptions(window)).data;
}
