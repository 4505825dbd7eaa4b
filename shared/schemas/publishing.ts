import { z } from 'zod';
import { instantSchema } from './common';
import { timeZoneSchema } from './planning-fields';
import { roundupStateSchema } from './roundup-state';
import { multiLineText, singleLineText } from './text';
import { calendarDate, dateRanges } from './dates';

/** Schedule (or reschedule) a roundup: a local date and time in an IANA zone; the server works out the instant. */
export const scheduleRoundupRequestSchema = z.strictObject({
  date: calendarDate(dateRanges.planning),
  time: z
    .string()
    .regex(/^([01]\d|2[0-3]):[0-5]\d(:[0-5]\d)?$/, 'Enter the time as HH:MM on a 24-hour clock, e.g. 09:00.'),
  timeZone: timeZoneSchema,
});
export type ScheduleRoundupRequest = z.infer<typeof scheduleRoundupRequestSchema>;

export const publicationKindSchema = z.enum(['publication', 'update', 'correction']);

/** Publish the current state of a live roundup to readers, logged on its page with a dated note. */
export const publishUpdateRequestSchema = z.strictObject({
  kind: z.enum(['update', 'correction']),
  note: multiLineText(2000, 'Say what changed: readers see this note on the page.'),
});

export const previewLinkRequestSchema = z.strictObject({
  /** How long the link works, in hours (at most 30 days). */
  hours: z.number().int().min(1, 'At least one hour.').max(720, 'At most 720 hours (30 days).'),
});

export const previewLinkSchema = z.object({ url: z.string(), path: z.string(), expiresAt: instantSchema });

export const roundupPublishingSchema = z.object({
  roundupId: z.number().int(),
  state: roundupStateSchema,
  /** Whether it may be scheduled now, and what stands in the way when not. */
  readiness: z.object({
    ready: z.boolean(),
    /** Each blocker in words, with the staff screen where it is fixed. */
    problems: z.array(z.object({ message: z.string(), link: z.string().nullable() })),
  }),
  schedule: z
    .object({
      publishAt: instantSchema,
      date: z.string(),
      time: z.string(),
      timeZone: z.string(),
      /** e.g. "UTC+02:00": the zone's offset at that instant. */
      utcOffset: z.string(),
      /** The local time is the first of two (the hour repeated when clocks go back). */
      ambiguous: z.boolean(),
    })
    .nullable(),
  publications: z.array(
    z.object({
      version: z.number().int(),
      kind: publicationKindSchema,
      note: z.string().nullable(),
      publishedAt: instantSchema,
      publishedBy: z.object({ id: z.number().int(), displayName: z.string() }).nullable(),
    }),
  ),
  /** The public page once published; null before. */
  publicPath: z.string().nullable(),
});
export type RoundupPublishing = z.infer<typeof roundupPublishingSchema>;

/** What readers get as open data: the raw logger files of this roundup (or not), and the outlet's licence line. */
export const openDataSettingsSchema = z.object({
  roundupId: z.number().int(),
  /** Raw logger files of this roundup's runs of record are downloadable on its public page. */
  rawFilesAllowed: z.boolean(),
  /** The outlet's licence line, printed with the open data of every roundup. */
  licence: z.string(),
  /** How many runs of record have a logger file that would be offered. */
  rawFileCount: z.number().int(),
});
export type OpenDataSettings = z.infer<typeof openDataSettingsSchema>;

export const openDataSettingsRequestSchema = z.strictObject({
  rawFilesAllowed: z.boolean(),
  licence: singleLineText(300, 'Write the licence line readers see beside the open data.'),
});
export type OpenDataSettingsRequest = z.infer<typeof openDataSettingsRequestSchema>;
