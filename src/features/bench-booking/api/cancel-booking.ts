import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';

/** Cancels a booking: testers their own, editors any. */
export function useCancelBooking() {
  return useChangeMutation(
    ({ benchId, bookingId }: { benchId: number; bookingId: number }): Promise<void> =>
      apiClient.delete(`/api/benches/${benchId}/bookings/${bookingId}`),
    'booking',
  );
}
