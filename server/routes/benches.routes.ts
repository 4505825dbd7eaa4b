import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { benchWorkers, bookers, planEditors, planningReaders } from '../../shared/access/roles';
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
import {
  benchDetailSchema,
  createInstrumentRequestSchema,
  createMaintenanceRequestSchema,
  instrumentParamsSchema,
  instrumentSchema,
  maintenanceEntrySchema,
  updateInstrumentRequestSchema,
} from '../../shared/schemas/bench-detail';

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
    handler: ({ user, params }) => benches.cancel(user, params.id, params.bookingId),
  });

  api.add({
    method: 'get',
    path: '/api/benches/:id/detail',
    access: planningReaders,
    tag: 'Benches',
    summary: 'One bench: its set-up, probes and logger with their calibration, and its maintenance log.',
    params: idParamSchema,
    response: benchDetailSchema,
    handler: ({ params }) => benches.detail(params.id),
  });

  api.add({
    method: 'post',
    path: '/api/benches/:id/instruments',
    access: planEditors,
    tag: 'Benches',
    summary: 'Add a probe or logger to a bench, with its calibration date and interval.',
    params: idParamSchema,
    body: createInstrumentRequestSchema,
    response: instrumentSchema,
    handler: ({ user, params, body }) => benches.addInstrument(user, params.id, body),
  });

  api.add({
    method: 'patch',
    path: '/api/benches/:id/instruments/:instrumentId',
    access: planEditors,
    tag: 'Benches',
    summary: 'Edit a probe or logger, e.g. its new calibration date.',
    params: instrumentParamsSchema,
    body: updateInstrumentRequestSchema,
    response: instrumentSchema,
    handler: ({ user, params, body }) => benches.updateInstrument(user, params.id, params.instrumentId, body),
  });

  api.add({
    method: 'post',
    path: '/api/benches/:id/maintenance',
    access: benchWorkers,
    tag: 'Benches',
    summary: 'Log maintenance done on a bench.',
    params: idParamSchema,
    body: createMaintenanceRequestSchema,
    response: maintenanceEntrySchema,
    handler: ({ user, params, body }) => benches.addMaintenance(user, params.id, body),
  });
}
