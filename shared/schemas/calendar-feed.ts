import { z } from 'zod';
import { instantSchema } from './common';

/** Whether the signed-in tester has a private calendar feed; its address is shown only when it is made. */
export const calendarFeedSchema = z.object({
  enabled: z.boolean(),
  createdAt: instantSchema.nullable(),
});
export type CalendarFeed = z.infer<typeof calendarFeedSchema>;

/** A new feed address (made or reset). The secret in it is not stored, so this is the only time it is shown. */
export const calendarFeedCreatedSchema = z.object({
  /** Site-relative, e.g. /api/calendar/3q…Xw.ics; the client puts its own origin in front. */
  path: z.string(),
  createdAt: instantSchema,
});
export type CalendarFeedCreated = z.infer<typeof calendarFeedCreatedSchema>;

/** 32 random bytes in base64url: 43 characters. Anything else cannot be a feed. */
export const calendarFeedParamsSchema = z.object({ token: z.string() });
export const CALENDAR_TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;
