import { z } from 'zod';
import { instantSchema, pathIdsSchema } from './common';
import {
  idSchema,
  namedRecordFields,
  namedRefSchema,
  optionalTextSchema,
  personRefSchema,
  requiredTextSchema,
  timestampFields,
} from './planning-fields';
import { queueItemSchema } from './matrix';
import { bookingInstantSchema, dateRanges, zonedInstant } from './dates';
import { optionalMultiLineText } from './text';
import { whenValid } from './checks';

/** A physical test system with its own booking calendar. */
export const createBenchRequestSchema = z.strictObject({
  name: requiredTextSchema(80, 'Name the bench.'),
  location: optionalTextSchema(120),
  /** The bench profile this bench is built to, if any. */
  benchProfileId: idSchema.nullable().default(null),
  notes: optionalMultiLineText(500),
});
export type CreateBenchRequest = z.input<typeof createBenchRequestSchema>;
export type ParsedCreateBenchRequest = z.output<typeof createBenchRequestSchema>;

export const updateBenchRequestSchema = z
  .strictObject({
    name: requiredTextSchema(80, 'Name the bench.'),
    location: optionalTextSchema(120),
    benchProfileId: idSchema.nullable(),
    notes: optionalMultiLineText(500),
    /** Inactive benches take no new bookings. */
    active: z.boolean(),
  })
  .partial();
export type UpdateBenchRequest = z.input<typeof updateBenchRequestSchema>;
export type ParsedUpdateBenchRequest = z.output<typeof updateBenchRequestSchema>;

export const benchSchema = z.object({
  ...namedRecordFields,
  location: z.string().nullable(),
  benchProfile: namedRefSchema.nullable(),
  notes: z.string().nullable(),
  active: z.boolean(),
  ...timestampFields,
});
export type Bench = z.infer<typeof benchSchema>;
export const benchListSchema = z.object({ benches: z.array(benchSchema) });

/** Longest single booking; longer work is booked as several slots. Common practice, no source. */
export const MAX_BOOKING_HOURS = 72;

/** Instants with an explicit zone (Z or an offset), within the booking years once in UTC; the API answers in UTC. */
const zonedInstantSchema = bookingInstantSchema;

/**
 * Book a bench for [startsAt, endsAt) against cells assigned to you. Bookings on one bench may touch
 * (one ends 12:00, the next starts 12:00) but not overlap; an overlap is refused with 409 booking_overlap.
 */
export const createBookingRequestSchema = z
  .strictObject({
    startsAt: zonedInstantSchema,
    endsAt: zonedInstantSchema,
    cellIds: z
      .array(idSchema)
      .min(1, 'Choose the assigned cells this slot is for.')
      .max(50)
      .refine((ids) => new Set(ids).size === ids.length, 'List each cell once.'),
    note: optionalMultiLineText(300),
    /**
     * Why to book anyway when the bench's set-up differs from the roundup's bench profile; without it such a
     * booking is refused with 409 bench_profile_mismatch, which lists the differences. Kept on the booking.
     */
    overrideReason: optionalMultiLineText(300),
  })
  .superRefine(
    (v, ctx) => {
      const start = Date.parse(v.startsAt);
      const end = Date.parse(v.endsAt);
      if (!(end > start))
        ctx.addIssue({ code: 'custom', path: ['endsAt'], message: 'The slot must end after it starts.' });
      else if (end - start > MAX_BOOKING_HOURS * 3_600_000) {
        ctx.addIssue({
          code: 'custom',
          path: ['endsAt'],
          message: `Book at most ${MAX_BOOKING_HOURS} hours at a time.`,
        });
      }
    },
    { when: whenValid('startsAt', 'endsAt') },
  );
export type CreateBookingRequest = z.input<typeof createBookingRequestSchema>;
export type ParsedCreateBookingRequest = z.output<typeof createBookingRequestSchema>;

export const bookingSchema = z.object({
  id: z.number().int(),
  bench: namedRefSchema,
  tester: personRefSchema,
  startsAt: instantSchema,
  endsAt: instantSchema,
  note: z.string().nullable(),
  /** Why it was booked although the bench's set-up differs from a roundup's bench profile. */
  overrideReason: z.string().nullable(),
  cells: z.array(queueItemSchema),
  /** The signed-in user may cancel it (their own, or any for an editor). */
  cancellable: z.boolean(),
  createdAt: instantSchema,
});
export type Booking = z.infer<typeof bookingSchema>;
export const bookingListSchema = z.object({ bookings: z.array(bookingSchema) });

/** Calendar window; defaults to from now − 1 day to now + 14 days. */
export const bookingListQuerySchema = z.object({
  from: z.preprocess((v) => (v === '' ? undefined : v), zonedInstant(dateRanges.booking).optional()),
  to: z.preprocess((v) => (v === '' ? undefined : v), zonedInstant(dateRanges.booking).optional()),
});

export const bookingParamsSchema = pathIdsSchema('id', 'bookingId');

/** A tester's own work: queue by due date (no date last), recorded cells waiting for the editor, bookings. */
export const myBenchSchema = z.object({
  queue: z.array(queueItemSchema),
  awaitingReview: z.array(queueItemSchema),
  upcomingBookings: z.array(bookingSchema),
});
export type MyBench = z.infer<typeof myBenchSchema>;
