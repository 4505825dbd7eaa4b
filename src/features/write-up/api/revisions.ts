import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  revisionDetailSchema,
  revisionListSchema,
  sectionSummarySchema,
  type RevisionDetail,
  type RevisionSummary,
  type SectionSummary,
} from '../../../../shared/schemas/write-ups';
import { writeUpKeys } from './write-up-keys';

export function revisionsQueryOptions(sectionId: number) {
  return queryOptions({
    queryKey: [...writeUpKeys.item('revisions'), sectionId],
    queryFn: async ({ signal }): Promise<RevisionSummary[]> =>
      (await apiClient.get(`/api/write-up/sections/${sectionId}/revisions`, { signal, schema: revisionListSchema }))
        .revisions,
  });
}

export function useRevisions(sectionId: number, enabled: boolean) {
  return useQuery({ ...revisionsQueryOptions(sectionId), enabled });
}

export function useRevision(sectionId: number, revisionId: number | null) {
  return useQuery({
    queryKey: [...writeUpKeys.item('revision'), sectionId, revisionId],
    queryFn: ({ signal }): Promise<RevisionDetail> =>
      apiClient.get(`/api/write-up/sections/${sectionId}/revisions/${revisionId}`, {
        signal,
        schema: revisionDetailSchema,
      }),
    enabled: revisionId !== null,
  });
}

export function restoreRevision(input: {
  sectionId: number;
  revisionId: number;
  baseVersion: number;
}): Promise<SectionSummary> {
  return apiClient.post(
    `/api/write-up/sections/${input.sectionId}/revisions/${input.revisionId}/restore`,
    { baseVersion: input.baseVersion },
    { schema: sectionSummarySchema },
  );
}

export function useRestoreRevision() {
  return useChangeMutation(restoreRevision, 'writeUp');
}
