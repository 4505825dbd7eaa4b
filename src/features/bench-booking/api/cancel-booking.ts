import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { invalidatePlanning } from '../../../lib/invalidate-planning';

export interface CancelBookingInput {
  benchId: number;
  bookingId: number;
}

export function cancelBooking({ benchId, bookingId }: CancelBookingInput): Promise<void> {
  return apiClient.delete(`/api/benches/${benchId}/bookings/${bookingId}`);
}

export function useCancelBooking() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: cancelBooking, onSuccess: () => invalidatePlanning(queryClient) });
}
