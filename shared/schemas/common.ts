import { z } from 'zod';

/** The four staff roles. Order matters only for display. */
export const roles = ['admin', 'editor', 'writer', 'tester'] as const;
export const roleSchema = z.enum(roles);
export type Role = z.infer<typeof roleSchema>;

export const roleLabels: Record<Role, string> = {
  admin: 'Admin',
  editor: 'Editor',
  writer: 'Writer',
  tester: 'Bench tester',
};

/** Every API error has this shape. */
export const apiErrorSchema = z.object({
  error: z.object({
    code: z.string(),
    message: z.string(),
    fields: z.record(z.string(), z.string()).optional(),
  }),
});
export type ApiError = z.infer<typeof apiErrorSchema>;

export const idParamSchema = z.object({ id: z.coerce.number().int().positive() });

/** ISO 8601 instant in UTC, as the API sends every time. */
export const instantSchema = z.iso.datetime();

export const okSchema = z.object({ ok: z.literal(true) });
