import { z } from 'zod';
import { countsSchema } from './common';
import { multiLineText, optionalMultiLineText, optionalSingleLineText, singleLineText } from './text';

export const subscriberEmailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .max(254, 'An e-mail address has at most 254 characters.')
  .pipe(z.email('Enter an e-mail address like name@example.com.'));

/** A reader's sign-up: address, categories, and the honeypot field people never see (bots fill it in). */
export const signUpRequestSchema = z
  .object({
    email: subscriberEmailSchema,
    categoryIds: z
      .array(z.coerce.number().int().positive())
      .min(1, 'Choose at least one subject.')
      .max(50, 'Choose at most 50 subjects.'),
    website: optionalSingleLineText(500),
  })
  .strict();
export type SignUpRequest = z.infer<typeof signUpRequestSchema>;

/** The same answer for every address, known or not. */
export const signUpAnswerSchema = z.object({ status: z.literal('check-your-inbox'), message: z.string() });

export const confirmRequestSchema = z.object({ token: singleLineText(200) }).strict();

export const mailCategorySchema = z.object({
  id: z.number().int(),
  name: z.string(),
  description: z.string().nullable(),
  matchProductClass: z.string().nullable(),
  matchPlatform: z.string().nullable(),
  position: z.number().int(),
});
export type MailCategory = z.infer<typeof mailCategorySchema>;

export const mailCategoryListSchema = z.object({ categories: z.array(mailCategorySchema) });

export const staffMailCategorySchema = mailCategorySchema.extend({ confirmedSubscribers: z.number().int() });
export const staffMailCategoryListSchema = z.object({
  categories: z.array(staffMailCategorySchema),
  subscribers: countsSchema('pending', 'confirmed', 'unsubscribed'),
});
export type StaffMailCategoryList = z.infer<typeof staffMailCategoryListSchema>;

const optionalMatch = (max: number) =>
  z
    .union([singleLineText(max), z.literal(''), z.null()])
    .optional()
    .transform((v) => (v ? v : null));

export const mailCategoryInputSchema = z
  .object({
    name: singleLineText(80, 'Give the subject a name.'),
    description: optionalMultiLineText(300)
      .nullable()
      .transform((v) => v || null),
    matchProductClass: optionalMatch(32),
    matchPlatform: optionalMatch(80),
    position: z.number().int().min(0).max(1000).optional(),
  })
  .strict();
export type MailCategoryInput = z.input<typeof mailCategoryInputSchema>;

export const mailingCountsSchema = countsSchema(
  'queued',
  'sending',
  'sent',
  'deferred',
  'failed',
  'suppressed',
  'total',
);
export type MailingCounts = z.infer<typeof mailingCountsSchema>;

export const mailingSchema = z.object({
  id: z.number().int(),
  kind: z.enum(['go-live', 'update', 'correction']),
  note: z.string().nullable(),
  createdAt: z.string(),
  counts: mailingCountsSchema,
});
export type Mailing = z.infer<typeof mailingSchema>;
export const roundupMailingsSchema = z.object({
  mailings: z.array(mailingSchema),
  /** Whether mail can go out now (a relay is configured). */
  sending: z.boolean(),
});
export type RoundupMailings = z.infer<typeof roundupMailingsSchema>;

/** An update or correction of a live roundup, mailed only when an editor chooses to. */
export const createMailingRequestSchema = z
  .object({
    kind: z.enum(['update', 'correction']),
    note: multiLineText(2000, 'Say what changed: subscribers read this first.'),
  })
  .strict();

export const staffMailKinds = [
  'cell-assigned',
  'cell-sent-back',
  'loan-due-soon',
  'loan-overdue',
  'overdue-digest',
] as const;
export type StaffMailKind = (typeof staffMailKinds)[number];
export const staffMailKindLabels: Record<StaffMailKind, string> = {
  'cell-assigned': 'A cell is assigned to me',
  'cell-sent-back': 'A cell of mine is sent back for a retest',
  'loan-due-soon': 'A vendor loan of my roundup is due back in three days',
  'loan-overdue': 'A vendor loan of my roundup is overdue',
  'overdue-digest': 'Daily digest of overdue cells',
};

export const mailPreferencesSchema = z.object({
  kinds: z.array(z.object({ kind: z.enum(staffMailKinds), label: z.string(), enabled: z.boolean() })),
});
export type MailPreferences = z.infer<typeof mailPreferencesSchema>;
export const updateMailPreferencesSchema = z
  .object({ disabled: z.array(z.enum(staffMailKinds)).max(staffMailKinds.length) })
  .strict();

/** A bounce or complaint reported by a real relay (POST /api/mail/events with the shared secret). */
export const mailEventSchema = z
  .object({
    type: z.enum(['bounce', 'complaint']),
    email: subscriberEmailSchema,
    /** Bounces: true for a permanent failure (5xx); temporary bounces are only counted. */
    permanent: z.boolean().optional(),
  })
  .strict();
export const mailEventsRequestSchema = z.object({ events: z.array(mailEventSchema).min(1).max(1000) }).strict();
