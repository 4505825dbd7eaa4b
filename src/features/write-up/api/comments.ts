import { useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  commentThreadListSchema,
  commentThreadSchema,
  type AddCommentRequest,
  type CommentThread,
} from '../../../../shared/schemas/write-ups';
import { writeUpKeys } from './write-up-keys';

export function useCommentThreads(sectionId: number) {
  return useQuery({
    queryKey: [...writeUpKeys.item('comments'), sectionId],
    queryFn: async ({ signal }): Promise<CommentThread[]> =>
      (
        await apiClient.get(`/api/write-up/sections/${sectionId}/comments`, {
          signal,
          schema: commentThreadListSchema,
        })
      ).threads,
  });
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
