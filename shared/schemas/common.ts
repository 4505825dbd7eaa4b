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

/** One id in a route path (`/roundups/:id/entries/:entryId`): a positive whole number, read from the text. */
export const pathIdSchema = z.coerce.number().int().positive();

/** The path parameters of a route whose parameters are all record ids, by name in path order. */
export function pathIdsSchema<const Name extends string>(...names: Name[]) {
  return z.object(Object.fromEntries(names.map((name) => [name, pathIdSchema])) as Record<Name, typeof pathIdSchema>);
}

export const idParamSchema = pathIdsSchema('id');

/** ISO 8601 instant in UTC, as the API sends every time. */
export const instantSchema = z.iso.datetime();

/** Whole-number counts, one per name, in this order (what a job or a mailing did, how many are in each state). */
export function countsSchema<const Name extends string>(...names: Name[]) {
  const count = z.number().int();
  return z.object(Object.fromEntries(names.map((name) => [name, count])) as Record<Name, typeof count>);
}

export const okSchema = z.object({ ok: z.literal(true) });
