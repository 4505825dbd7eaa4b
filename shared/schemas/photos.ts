import { z } from 'zod';
import { instantSchema, pathIdsSchema } from './common';
import { entryRecordFields, idSchema, personRefSchema, requiredTextSchema } from './planning-fields';
import { optionalSingleLineText } from './text';

export const photoKinds = ['overview', 'power-delivery', 'heatsinks', 'thermal-image', 'other'] as const;
export const photoKindSchema = z.enum(photoKinds, { error: 'Choose what the photo shows.' });
export const photoKindLabels: Record<(typeof photoKinds)[number], string> = {
  overview: 'Board overview',
  'power-delivery': 'Power delivery close-up',
  heatsinks: 'Heatsinks',
  'thermal-image': 'Thermal image',
  other: 'Other',
};

const captionSchema = optionalSingleLineText(300).transform((value) => value ?? '');
/** Alt text is required: it is what a screen reader says, and what shows when the image cannot load. */
const altTextMessage = 'Describe the photo for people who cannot see it.';
const altTextSchema = z.string({ error: altTextMessage }).pipe(requiredTextSchema(300, altTextMessage));

/** The text fields sent beside the photo file. */
export const photoUploadFieldsSchema = z.object({
  kind: photoKindSchema,
  caption: captionSchema,
  altText: altTextSchema,
});
export type PhotoUploadFields = z.input<typeof photoUploadFieldsSchema>;
export type ParsedPhotoUploadFields = z.output<typeof photoUploadFieldsSchema>;

export const updatePhotoRequestSchema = z.strictObject(photoUploadFieldsSchema.shape).partial();
export type ParsedUpdatePhotoRequest = z.output<typeof updatePhotoRequestSchema>;

export const reorderPhotosRequestSchema = z.strictObject({
  photoIds: z.array(idSchema).min(1, 'List the photos in their new order.').max(200),
});
export type ParsedReorderPhotosRequest = z.output<typeof reorderPhotosRequestSchema>;

/** An image's size in pixels. */
export const pixelSizeFields = { width: z.number().int(), height: z.number().int() };

export const photoSizeSchema = z.object({
  ...pixelSizeFields,
  format: z.enum(['webp', 'jpeg']),
  url: z.string(),
});

export const photoSchema = z.object({
  ...entryRecordFields,
  kind: photoKindSchema,
  caption: z.string(),
  altText: z.string(),
  position: z.number().int(),
  ...pixelSizeFields,
  sizes: z.array(photoSizeSchema),
  uploadedBy: personRefSchema,
  createdAt: instantSchema,
});
export type Photo = z.infer<typeof photoSchema>;

export const photoListSchema = z.object({ photos: z.array(photoSchema) });

export const entryPhotosParamsSchema = pathIdsSchema('id', 'entryId');
export const photoParamsSchema = pathIdsSchema('photoId');
export const photoFileParamsSchema = photoParamsSchema.extend({
  size: z.string().regex(/^\d{1,4}\.(webp|jpeg)$/, 'Ask for a size such as 960.webp.'),
});
