import { useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { endpointFieldQueryOptions } from '../../../lib/endpoint-query';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  commentThreadListSchema,
  commentThreadSchema,
  type AddCommentRequest,
} from '../../../../shared/schemas/write-ups';
import { writeUpKeys } from './write-up-keys';

export function useCommentThreads(sectionId: number) {
  return useQuery(
    endpointFieldQueryOptions(
      [...writeUpKeys.item('comments'), sectionId],
      `/api/write-up/sections/${sectionId}/comments`,
      commentThreadListSchema,
      'threads',
    ),
  );
}

export function useAddComment(sectionId: number) {
  return useChangeMutation(
    (body: AddCommentRequest) =>
      apiClient.post(`/api/write-up/sections/${sectionId}/comments`, body, { schema: commentThreadSchema }),
    'writeUp',
  );
}

export function useResolveThread() {
  return useChangeMutation(
    ({ commentId, resolved }: { commentId: number; resolved: boolean }) =>
      apiClient.post(`/api/write-up/comments/${commentId}/${resolved ? 'resolve' : 'reopen'}`, undefined, {
        schema: commentThreadSchema,
      }),
    'writeUp',
  );
}
