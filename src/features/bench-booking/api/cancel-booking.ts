import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';

export interface CancelBookingInput {
  benchId: number;
  bookingId: number;
}

/** Cancels a booking: testers their own, editors any. */
export function cancelBooking({ benchId, bookingId }: CancelBookingInput): Promise<void> {
  return apiClient.delete(`/api/benches/${benchId}/bookings/${bookingId}`);
}

export function useCancelBooking() {
  return useChangeMutation(cancelBooking, 'booking');
}
