import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { sectionDetailSchema, type SectionDetail } from '../../../../shared/schemas/write-ups';
import { writeUpKeys } from './write-up-keys';

export function getSection(sectionId: number, signal?: AbortSignal): Promise<SectionDetail> {
  return apiClient.get(`/api/write-up/sections/${sectionId}`, { signal, schema: sectionDetailSchema });
}

export function sectionQueryOptions(sectionId: number) {
  return queryOptions({
    queryKey: [...writeUpKeys.item('section'), sectionId],
    queryFn: ({ signal }) => getSection(sectionId, signal),
    // The editor owns the text once open: no refetch on focus would overwrite what is being typed.
    refetchOnWindowFocus: false,
  });
}

export function useSection(sectionId: number) {
  return useSuspenseQuery(sectionQueryOptions(sectionId)).data;
}
