import { z } from 'zod';
import { pathIdsSchema } from './common';
import { queryText } from './text';

export const devInboxQuerySchema = z
  .object({
    /** Only messages to this address (exact, case-insensitive). */
    to: queryText(320).optional(),
    limit: z.coerce.number().int().min(1).max(200).default(50),
  })
  .strict();
export type DevInboxQuery = z.infer<typeof devInboxQuerySchema>;

export const devInboxItemSchema = z.object({
  id: z.number().int(),
  from: z.string(),
  to: z.string(),
  subject: z.string(),
  sizeBytes: z.number().int(),
  receivedAt: z.string(),
});
export type DevInboxItem = z.infer<typeof devInboxItemSchema>;

export const devInboxSchema = z.object({
  /** False when mail goes through a real relay: there is no dev inbox then. */
  enabled: z.boolean(),
  total: z.number().int(),
  messages: z.array(devInboxItemSchema),
});
export type DevInbox = z.infer<typeof devInboxSchema>;

export const devInboxMessageSchema = devInboxItemSchema.extend({
  messageId: z.string().nullable(),
  headers: z.array(z.object({ name: z.string(), value: z.string() })),
  text: z.string().nullable(),
  /** The HTML part with inline images (cid:) turned into data: addresses, for a sandboxed frame. */
  html: z.string().nullable(),
  attachments: z.array(
    z.object({
      filename: z.string().nullable(),
      contentType: z.string(),
      sizeBytes: z.number().int(),
      contentId: z.string().nullable(),
      inline: z.boolean(),
    }),
  ),
});
export type DevInboxMessage = z.infer<typeof devInboxMessageSchema>;

export const devInboxParamsSchema = pathIdsSchema('id');
