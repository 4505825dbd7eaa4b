import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidateAfter } from '../../../lib/stale-after';

export interface CancelBookingInput {
  benchId: number;
  bookingId: number;
}

/** Cancels a booking: testers their own, editors any. */
export function cancelBooking({ benchId, bookingId }: CancelBookingInput): Promise<void> {
  return apiClient.delete(`/api/benches/${benchId}/bookings/${bookingId}`);
}

export function useCancelBooking() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: cancelBooking, onSuccess: () => invalidateAfter(queryClient, 'booking') });
}
