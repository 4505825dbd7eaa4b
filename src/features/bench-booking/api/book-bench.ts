import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { bookingSchema, type Booking, type CreateBookingRequest } from '../../../../shared/schemas/benches';
import { invalidatePlanning } from '../../../lib/invalidate-planning';

export interface BookBenchInput {
  benchId: number;
  booking: CreateBookingRequest;
}

/** Books a slot against the tester's assigned cells; an overlapping slot on the bench is refused with 409. */
export function bookBench({ benchId, booking }: BookBenchInput): Promise<Booking> {
  return apiClient.post(`/api/benches/${benchId}/bookings`, booking, { schema: bookingSchema });
}

export function useBookBench() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: bookBench, onSuccess: () => invalidatePlanning(queryClient) });
}
