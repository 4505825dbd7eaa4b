import { z } from 'zod';
import { instantSchema, pathIdsSchema } from './common';
import { personRefSchema, timestampFields } from './planning-fields';
import { roundupStates } from '../domain/planning/roundup-states';
import { sectionKinds, sectionReviewMoves, sectionReviewStates } from '../domain/editorial/section-states';
import { multiLineText, optionalMultiLineText, singleLineText } from './text';
import { liveBlockKinds, writeUpDocumentSchema } from './write-up-document';
import { pixelSizeFields } from './photos';

export const sectionSummarySchema = z.object({
  id: z.number().int(),
  roundupId: z.number().int(),
  kind: z.enum(sectionKinds),
  entryId: z.number().int().nullable(),
  title: z.string(),
  position: z.number().int(),
  version: z.number().int(),
  reviewState: z.enum(sectionReviewStates),
  reviewStateChangedAt: instantSchema,
  reviewStateChangedBy: personRefSchema.nullable(),
  updatedAt: instantSchema,
  updatedBy: personRefSchema.nullable(),
  openThreadCount: z.number().int(),
  /** The review moves the caller may make now. */
  moves: z.array(z.enum(sectionReviewMoves)),
});
export type SectionSummary = z.infer<typeof sectionSummarySchema>;

export const writeUpOverviewSchema = z.object({
  roundupId: z.number().int(),
  roundupTitle: z.string(),
  roundupState: z.enum(roundupStates),
  /** Whether the caller may change the text now (role and roundup state). */
  editable: z.boolean(),
  /** Why the write-up cannot change in this state, when it cannot. */
  lockedReason: z.string().nullable(),
  sections: z.array(sectionSummarySchema),
  /** What keeps the write-up from being ready, in sentences; empty when every section is signed off. */
  blocking: z.array(z.string()),
});
export type WriteUpOverview = z.infer<typeof writeUpOverviewSchema>;

export const liveBlockPreviewSchema = z.object({
  block: z.enum(liveBlockKinds),
  entryId: z.number().int(),
  productName: z.string(),
  /** Server-rendered, sanitised HTML of the block as the page will show it now. */
  html: z.string(),
});
export type LiveBlockPreview = z.infer<typeof liveBlockPreviewSchema>;

export const writeUpPhotoSchema = z.object({
  id: z.number().int(),
  entryId: z.number().int(),
  productName: z.string(),
  altText: z.string(),
  caption: z.string(),
  ...pixelSizeFields,
  /** A small size for the picker and the editor. */
  previewUrl: z.string(),
});
export type WriteUpPhoto = z.infer<typeof writeUpPhotoSchema>;

export const sectionDetailSchema = sectionSummarySchema.extend({
  content: writeUpDocumentSchema,
  editable: z.boolean(),
  lockedReason: z.string().nullable(),
  /** Every live block this roundup can show, rendered from current data. */
  liveBlocks: z.array(liveBlockPreviewSchema),
  photos: z.array(writeUpPhotoSchema),
});
export type SectionDetail = z.infer<typeof sectionDetailSchema>;

export const sectionParamsSchema = pathIdsSchema('sectionId');
export const revisionParamsSchema = pathIdsSchema('sectionId', 'revisionId');
export const commentParamsSchema = pathIdsSchema('commentId');

const baseVersionSchema = z
  .number({ error: 'Say which version of the section this change starts from.' })
  .int()
  .positive();

export const saveSectionRequestSchema = z.strictObject({
  baseVersion: baseVersionSchema,
  title: singleLineText(200, 'Give the section a title.').optional(),
  content: writeUpDocumentSchema,
});
export type SaveSectionRequest = z.input<typeof saveSectionRequestSchema>;
export type ParsedSaveSectionRequest = z.output<typeof saveSectionRequestSchema>;

/** What a 409 `stale_version` carries: the section as it stands, and where the refused text was kept. */
export const staleVersionDetailsSchema = z.object({
  current: z.object({
    version: z.number().int(),
    title: z.string(),
    content: writeUpDocumentSchema,
    updatedAt: instantSchema,
    updatedBy: personRefSchema.nullable(),
  }),
  refusedCopyRevisionId: z.number().int(),
});
export type StaleVersionDetails = z.infer<typeof staleVersionDetailsSchema>;

export const handBackRequestSchema = z.strictObject({
  /** Why, for the writer: kept as a comment thread on the section. */
  note: optionalMultiLineText(4000),
});

export const revisionKindSchema = z.enum(['prefill', 'save', 'restore', 'refused-copy']);
export const revisionSummarySchema = z.object({
  id: z.number().int(),
  kind: revisionKindSchema,
  version: z.number().int().nullable(),
  basedOnVersion: z.number().int().nullable(),
  restoredFromId: z.number().int().nullable(),
  title: z.string(),
  author: personRefSchema.nullable(),
  ...timestampFields,
});
export type RevisionSummary = z.infer<typeof revisionSummarySchema>;
export const revisionListSchema = z.object({ revisions: z.array(revisionSummarySchema) });
export const revisionDetailSchema = revisionSummarySchema.extend({
  content: writeUpDocumentSchema,
  html: z.string(),
});
export type RevisionDetail = z.infer<typeof revisionDetailSchema>;

export const restoreRevisionRequestSchema = z.strictObject({ baseVersion: baseVersionSchema });

export const commentSchema = z.object({
  id: z.number().int(),
  sectionId: z.number().int(),
  parentId: z.number().int().nullable(),
  author: personRefSchema,
  body: z.string(),
  createdAt: instantSchema,
});
export const commentThreadSchema = commentSchema.extend({
  resolvedAt: instantSchema.nullable(),
  resolvedBy: personRefSchema.nullable(),
  replies: z.array(commentSchema),
});
export type CommentThread = z.infer<typeof commentThreadSchema>;
export const commentThreadListSchema = z.object({ threads: z.array(commentThreadSchema) });

export const addCommentRequestSchema = z.strictObject({
  body: multiLineText(4000, 'Write the comment.'),
  /** The thread to reply to; absent to start a thread. */
  parentId: z.number().int().positive().nullable().optional(),
});
export type AddCommentRequest = z.input<typeof addCommentRequestSchema>;
export type ParsedAddCommentRequest = z.output<typeof addCommentRequestSchema>;
