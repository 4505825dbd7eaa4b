import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { sendStoredBytes } from '../lib/send-stored-bytes';
import { benchWorkers, planningReaders } from '../../shared/access/roles';
import {
  entryPhotosParamsSchema,
  photoFileParamsSchema,
  photoListSchema,
  photoParamsSchema,
  photoSchema,
  photoUploadFieldsSchema,
  reorderPhotosRequestSchema,
  updatePhotoRequestSchema,
} from '../../shared/schemas/photos';
import { photoUploadLimit } from '../../shared/upload-limits';
import { storageWriteErrors } from '../storage/storage-errors';

export function registerPhotoRoutes(api: ApiRegistry, { services }: AppContext) {
  const { photos } = services;

  api.add({
    method: 'get',
    path: '/api/roundups/:id/entries/:entryId/photos',
    access: planningReaders,
    tag: 'Photos',
    summary: 'The photos of one product in a roundup, in order, with their web sizes.',
    params: entryPhotosParamsSchema,
    response: photoListSchema,
    handler: async ({ params }) => ({ photos: await photos.list(params.id, params.entryId) }),
  });

  api.add({
    method: 'post',
    path: '/api/roundups/:id/entries/:entryId/photos',
    access: benchWorkers,
    tag: 'Photos',
    summary:
      'Add a photo (JPEG, PNG or WebP, judged by content) with its kind, caption and required alt text: it is turned upright, stripped of metadata and written at 480, 960 and 1920 px in WebP and JPEG.',
    params: entryPhotosParamsSchema,
    multipart: {
      fields: { file: 'file', kind: 'string', caption: 'string', altText: 'string' },
      limit: photoUploadLimit,
    },
    errors: storageWriteErrors,
    body: photoUploadFieldsSchema,
    response: photoSchema,
    handler: ({ req, params, user, body }) => photos.upload(user, params.id, params.entryId, req.file, body),
  });

  api.add({
    method: 'put',
    path: '/api/roundups/:id/entries/:entryId/photo-order',
    access: benchWorkers,
    tag: 'Photos',
    summary: 'Put the product’s photos in a new order (every photo listed once).',
    params: entryPhotosParamsSchema,
    body: reorderPhotosRequestSchema,
    response: photoListSchema,
    handler: async ({ params, user, body }) => ({
      photos: await photos.reorder(user, params.id, params.entryId, body),
    }),
  });

  api.add({
    method: 'patch',
    path: '/api/photos/:photoId',
    access: benchWorkers,
    tag: 'Photos',
    summary: 'Change a photo’s kind, caption or alt text.',
    params: photoParamsSchema,
    body: updatePhotoRequestSchema,
    response: photoSchema,
    handler: ({ params, user, body }) => photos.update(user, params.photoId, body),
  });

  api.add({
    method: 'delete',
    path: '/api/photos/:photoId',
    access: benchWorkers,
    tag: 'Photos',
    summary: 'Remove a photo and its web sizes.',
    params: photoParamsSchema,
    handler: ({ params, user }) => photos.remove(user, params.photoId),
  });

  api.add({
    method: 'get',
    path: '/api/photos/:photoId/files/:size',
    access: planningReaders,
    tag: 'Photos',
    summary: 'One web size of a photo (e.g. 960.webp), for signed-in staff only until the roundup is published.',
    params: photoFileParamsSchema,
    produces: 'image/webp',
    handler: async ({ params, res }) => {
      const { body, contentType } = await photos.file(params.photoId, params.size);
      sendStoredBytes(res, body, contentType, 'private, max-age=3600', {
        'Content-Disposition': `inline; filename="photo-${params.photoId}-${params.size}"`,
      });
    },
  });
}
