import { z } from 'zod';
import { instantSchema, roleSchema } from './common';
import { currentUserSchema, emailSchema, newPasswordSchema, withRepeatedPassword } from './auth';
import { timestampFields } from './planning-fields';
import { singleLineText } from './text';

export const displayNameSchema = singleLineText(120, 'Enter a name.');

export const userSchema = currentUserSchema.extend({
  active: z.boolean(),
  ...timestampFields,
  lastSignInAt: instantSchema.nullable(),
  /** false for an invited account whose owner has not set a password yet (it cannot sign in). */
  passwordSet: z.boolean(),
  /** The open invitation of an account without a password; null once accepted, withdrawn or never sent. */
  invitation: z
    .object({
      sentAt: instantSchema,
      expiresAt: instantSchema,
      expired: z.boolean(),
    })
    .nullable(),
});
export type User = z.infer<typeof userSchema>;
export const userListSchema = z.object({ users: z.array(userSchema) });

/** How long an invitation link works. */
export const INVITATION_HOURS = 72;

/**
 * A new staff account. Without `password` the person is invited by mail and sets their own; with it the account
 * can sign in at once with that first password.
 */
export const createUserRequestSchema = z.strictObject({
  email: emailSchema,
  displayName: displayNameSchema,
  role: roleSchema,
  password: newPasswordSchema.optional(),
});
export type CreateUserRequest = z.infer<typeof createUserRequestSchema>;

/** Partial update: role, name, e-mail, active flag, or a new password set by the admin. */
export const updateUserRequestSchema = z
  .strictObject({
    email: emailSchema,
    displayName: displayNameSchema,
    role: roleSchema,
    active: z.boolean(),
    password: newPasswordSchema,
  })
  .partial();
export type UpdateUserRequest = z.infer<typeof updateUserRequestSchema>;

/** What the welcome page shows about an open invitation. */
export const invitationSchema = z.object({
  displayName: z.string(),
  email: z.string(),
  role: roleSchema,
  expiresAt: instantSchema,
});
export type Invitation = z.infer<typeof invitationSchema>;

/**
 * The invitation link's token (URL-safe base64 of 32 random bytes), as a path parameter. Any text of a plausible
 * length is looked up: one that matches no invitation is answered like an unknown link.
 */
export const invitationTokenParamsSchema = z.object({ token: z.string().min(1).max(200) });

/** The invited person's password, typed twice. Nothing else may be set here. */
export const acceptInvitationRequestSchema = withRepeatedPassword({}, 'The two passwords do not match.');
export type AcceptInvitationRequest = z.infer<typeof acceptInvitationRequestSchema>;
