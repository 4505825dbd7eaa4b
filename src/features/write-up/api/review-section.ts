import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';
import type { SectionReviewMove } from '../../../../shared/domain/editorial/section-states';
import { sectionSummarySchema, type SectionSummary } from '../../../../shared/schemas/write-ups';

const moveUrls: Record<SectionReviewMove, string> = {
  'hand-to-editor': 'review-request',
  'sign-off': 'sign-off',
  'hand-back': 'hand-back',
};

export interface ReviewSectionInput {
  sectionId: number;
  move: SectionReviewMove;
  note?: string;
}

export function reviewSection({ sectionId, move, note }: ReviewSectionInput): Promise<SectionSummary> {
  const body = move === 'hand-back' ? { note: note ?? null } : undefined;
  return apiClient.post(`/api/write-up/sections/${sectionId}/${moveUrls[move]}`, body, {
    schema: sectionSummarySchema,
  });
}

export function useReviewSection() {
  return useChangeMutation(reviewSection, 'writeUp');
}
