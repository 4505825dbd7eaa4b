import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { benchWorkers, bookers, planEditors, planningReaders } from './planning-access';
import { idParamSchema } from '../../shared/schemas/common';
import {
  benchListSchema,
  benchSchema,
  bookingListQuerySchema,
  bookingListSchema,
  bookingParamsSchema,
  bookingSchema,
  createBenchRequestSchema,
  createBookingRequestSchema,
  updateBenchRequestSchema,
} from '../../shared/schemas/benches';

export function registerBenchRoutes(api: ApiRegistry, { services }: AppContext) {
  const benches = services.benches;

  api.add({
    method: 'get',
    path: '/api/benches',
    access: planningReaders,
    tag: 'Benches',
    summary: 'Physical test systems.',
    response: benchListSchema,
    handler: async () => ({ benches: await benches.list() }),
  });

  api.add({
    method: 'post',
    path: '/api/benches',
    access: planEditors,
    tag: 'Benches',
    summary: 'Add a bench.',
    body: createBenchRequestSchema,
    response: benchSchema,
    handler: ({ user, body }) => benches.create(user, body),
  });

  api.add({
    method: 'patch',
    path: '/api/benches/:id',
    access: planEditors,
    tag: 'Benches',
    summary: 'Edit a bench or take it out of service.',
    params: idParamSchema,
    body: updateBenchRequestSchema,
    response: benchSchema,
    handler: ({ user, params, body }) => benches.update(user, params.id, body),
  });

  api.add({
    method: 'get',
    path: '/api/bookings',
    access: planningReaders,
    tag: 'Benches',
    summary: 'Bookings on all benches in a window (the calendar overview).',
    query: bookingListQuerySchema,
    response: bookingListSchema,
    handler: async ({ user, query }) => ({ bookings: await benches.bookings(user, query) }),
  });

  api.add({
    method: 'get',
    path: '/api/benches/:id/bookings',
    access: planningReaders,
    tag: 'Benches',
    summary: 'One bench’s calendar in a window (default: yesterday to two weeks ahead).',
    params: idParamSchema,
    query: bookingListQuerySchema,
    response: bookingListSchema,
    handler: async ({ user, params, query }) => ({
      bookings: await benches.bookings(user, { ...query, benchId: params.id }),
    }),
  });

  api.add({
    method: 'post',
    path: '/api/benches/:id/bookings',
    access: bookers,
    tag: 'Benches',
    summary: 'Book a slot against your assigned cells; an overlap on the bench is refused (409 booking_overlap).',
    params: idParamSchema,
    body: createBookingRequestSchema,
    response: bookingSchema,
    handler: ({ user, params, body }) => benches.book(user, params.id, body),
  });

  api.add({
    method: 'delete',
    path: '/api/benches/:id/bookings/:bookingId',
    access: benchWorkers,
    tag: 'Benches',
    summary: 'Cancel a booking: testers their own, editors any.',
    params: bookingParamsSchema,
    successStatus: 204,
    handler: async ({ user, params }) => {
      await benches.cancel(user, params.id, params.bookingId);
    },
  });
}
