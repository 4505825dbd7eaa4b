import { z } from 'zod';
import { instantSchema, roleSchema } from './common';
import { emailSchema, newPasswordSchema } from './auth';
import { singleLineText } from './text';

export const displayNameSchema = singleLineText(120, 'Enter a name.');

export const userSchema = z.object({
  id: z.number().int(),
  email: z.string(),
  displayName: z.string(),
  role: roleSchema,
  active: z.boolean(),
  createdAt: instantSchema,
  updatedAt: instantSchema,
  lastSignInAt: instantSchema.nullable(),
});
export type User = z.infer<typeof userSchema>;
export const userListSchema = z.object({ users: z.array(userSchema) });

export const createUserRequestSchema = z.strictObject({
  email: emailSchema,
  displayName: displayNameSchema,
  role: roleSchema,
  password: newPasswordSchema,
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
