import { z } from 'zod';
import { instantSchema, roleSchema } from './common';
import { passwordText } from './text';
import { whenValid } from './checks';

export const PASSWORD_MIN = 12;
export const PASSWORD_MAX = 128;

/** New passwords: 12 to 128 characters, used as typed (no trimming, no truncation), not only spaces. */
export const newPasswordSchema = passwordText(PASSWORD_MIN, PASSWORD_MAX);

interface RepeatedPassword {
  newPassword: string;
  confirmPassword: string;
}

/**
 * A form that sets a new password, typed twice, besides its other `fields`; when the two differ, `mismatch` is said
 * on the second.
 */
export function withRepeatedPassword<Fields extends z.ZodRawShape>(fields: Fields, mismatch: string) {
  return z
    .strictObject({ ...fields, newPassword: newPasswordSchema, confirmPassword: passwordText(0, PASSWORD_MAX) })
    .refine((v) => (v as RepeatedPassword).newPassword === (v as RepeatedPassword).confirmPassword, {
      path: ['confirmPassword'],
      message: mismatch,
      when: whenValid('newPassword', 'confirmPassword'),
    });
}

export const emailSchema = z
  .string()
  .trim()
  .toLowerCase()
  .pipe(z.email('Enter an e-mail address such as name@example.org.').max(254));

export const signInRequestSchema = z.strictObject({
  email: emailSchema,
  // Sign-in accepts any length up to the maximum so old passwords still work.
  password: passwordText(1, PASSWORD_MAX, 'Enter your password.'),
});
export type SignInRequest = z.infer<typeof signInRequestSchema>;

export const currentUserSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  role: roleSchema,
});
export type CurrentUser = z.infer<typeof currentUserSchema>;

export const sessionResponseSchema = z.object({ user: currentUserSchema });

export const changePasswordRequestSchema = withRepeatedPassword(
  { currentPassword: passwordText(1, PASSWORD_MAX, 'Enter your current password.') },
  'The two new passwords do not match.',
);
export type ChangePasswordRequest = z.infer<typeof changePasswordRequestSchema>;

export const sessionInfoSchema = z.object({
  /** The session's public id, for listing and revoking; the cookie value itself is never sent. */
  id: z.string(),
  current: z.boolean(),
  createdAt: instantSchema,
  expiresAt: instantSchema,
  userAgent: z.string().nullable(),
  ipAddress: z.string().nullable(),
});
export type SessionInfo = z.infer<typeof sessionInfoSchema>;
export const sessionListSchema = z.object({ sessions: z.array(sessionInfoSchema) });
