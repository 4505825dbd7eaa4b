import { useQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { endpointFieldQueryOptions, endpointQueryOptions } from '../../../lib/endpoint-query';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  revisionDetailSchema,
  revisionListSchema,
  sectionSummarySchema,
  type SectionSummary,
} from '../../../../shared/schemas/write-ups';
import { writeUpKeys } from './write-up-keys';

export function revisionsQueryOptions(sectionId: number) {
  return endpointFieldQueryOptions(
    [...writeUpKeys.item('revisions'), sectionId],
    `/api/write-up/sections/${sectionId}/revisions`,
    revisionListSchema,
    'revisions',
  );
}

export function useRevisions(sectionId: number, enabled: boolean) {
  return useQuery({ ...revisionsQueryOptions(sectionId), enabled });
}

export function useRevision(sectionId: number, revisionId: number | null) {
  return useQuery({
    ...endpointQueryOptions(
      [...writeUpKeys.item('revision'), sectionId, revisionId],
      `/api/write-up/sections/${sectionId}/revisions/${revisionId}`,
      revisionDetailSchema,
    ),
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
