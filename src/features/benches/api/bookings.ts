import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingSchema, type Booking, type CreateBookingRequest } from '../../../../shared/schemas/benches';
import { invalidateBookings } from './bench-keys';

export interface BookBenchInput {
  benchId: number;
  booking: CreateBookingRequest;
}

/** Books a slot against the tester's own assigned cells; an overlap on the bench is refused with 409. */
export function bookBench({ benchId, booking }: BookBenchInput): Promise<Booking> {
  return apiClient.post(`/api/benches/${benchId}/bookings`, booking, { schema: bookingSchema });
}

export function cancelBooking({ benchId, bookingId }: { benchId: number; bookingId: number }): Promise<void> {
  return apiClient.delete(`/api/benches/${benchId}/bookings/${bookingId}`);
}

export function useBookBench() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: bookBench, onSuccess: () => invalidateBookings(queryClient) });
}

export function useCancelBooking() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: cancelBooking, onSuccess: () => invalidateBookings(queryClient) });
}
