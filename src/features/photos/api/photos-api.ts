import { queryOptions, useMutation, useQueryClient, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient, apiRequest } from '../../../lib/api-client';
import { createQueryKeys } from '../../../lib/query-keys';
import { invalidateAfter, useChangeMutation } from '../../../lib/stale-after';
import { uploadFile, type UploadProgress } from '../../../lib/upload';
import { photoUploadLimit } from '../../../../shared/upload-limits';
import { photoListSchema, photoSchema, type Photo, type PhotoUploadFields } from '../../../../shared/schemas/photos';

export const photoKeys = createQueryKeys('photos');

const entryPhotosPath = (roundupId: number, entryId: number) => `/api/roundups/${roundupId}/entries/${entryId}/photos`;

export function entryPhotosQueryOptions(roundupId: number, entryId: number) {
  return queryOptions({
    queryKey: [...photoKeys.all, 'entry', roundupId, entryId] as const,
    queryFn: async ({ signal }) =>
      (await apiClient.get(entryPhotosPath(roundupId, entryId), { signal, schema: photoListSchema })).photos,
  });
}

export function useEntryPhotos(roundupId: number, entryId: number) {
  return useSuspenseQuery(entryPhotosQueryOptions(roundupId, entryId)).data;
}

export interface UploadPhotoInput {
  file: File;
  fields: PhotoUploadFields;
  onProgress?: (progress: UploadProgress) => void;
  signal?: AbortSignal;
}

/** POST one photo with its kind, caption and alt text through the one upload helper (progress, cancel, size check). */
export function useUploadPhoto(roundupId: number, entryId: number) {
  const queryClient = useQueryClient();
  const key = entryPhotosQueryOptions(roundupId, entryId).queryKey;
  return useMutation({
    mutationFn: ({ file, fields, onProgress, signal }: UploadPhotoInput) =>
      uploadFile({
        path: entryPhotosPath(roundupId, entryId),
        file: { blob: file, fileName: file.name },
        fields: { kind: fields.kind, caption: fields.caption ?? '', altText: fields.altText },
        schema: photoSchema,
        limit: photoUploadLimit,
        onProgress,
        signal,
      }),
    onSuccess: (photo) => {
      // The thumbnail shows at once; the list is then fetched again in the background.
      queryClient.setQueryData(key, (photos: Photo[] | undefined) =>
        photos && !photos.some((item) => item.id === photo.id) ? [...photos, photo] : photos,
      );
      return invalidateAfter(queryClient, 'photo');
    },
  });
}

export function useUpdatePhoto() {
  return useChangeMutation(
    ({ photoId, fields }: { photoId: number; fields: Partial<PhotoUploadFields> }) =>
      apiClient.patch(`/api/photos/${photoId}`, fields, { schema: photoSchema }),
    'photo',
  );
}

export function useRemovePhoto() {
  return useChangeMutation((photoId: number) => apiClient.delete(`/api/photos/${photoId}`), 'photo');
}

/** Puts the photos in a new order: shown at once, put back if the server refuses. */
export function useReorderPhotos(roundupId: number, entryId: number) {
  const queryClient = useQueryClient();
  const key = entryPhotosQueryOptions(roundupId, entryId).queryKey;
  return useMutation({
    mutationFn: (photoIds: number[]) =>
      apiRequest(`/api/roundups/${roundupId}/entries/${entryId}/photo-order`, {
        method: 'PUT',
        body: { photoIds },
        schema: photoListSchema,
      }),
    onMutate: async (photoIds) => {
      await queryClient.cancelQueries({ queryKey: key });
      const before = queryClient.getQueryData(key);
      if (before) {
        const byId = new Map(before.map((photo) => [photo.id, photo]));
        queryClient.setQueryData(
          key,
          photoIds.map((id) => byId.get(id)).filter((photo): photo is Photo => photo !== undefined),
        );
      }
      return { before };
    },
    onError: (_error, _ids, context) => {
      if (context?.before) queryClient.setQueryData(key, context.before);
    },
    onSettled: () => invalidateAfter(queryClient, 'photo'),
  });
}
