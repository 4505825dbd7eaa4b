import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';
import { bookingSchema, type CreateBookingRequest } from '../../../../shared/schemas/benches';

/**
 * Books a slot against the tester's own assigned cells. Refused with 409 when the bench or one of the cells is
 * already booked at that time, or when the bench's set-up differs from the roundup's profile and no reason to book
 * anyway was given.
 */
export function useBookBench() {
  return useChangeMutation(
    ({ benchId, booking }: { benchId: number; booking: CreateBookingRequest }) =>
      apiClient.post(`/api/benches/${benchId}/bookings`, booking, { schema: bookingSchema }),
    'booking',
  );
}
