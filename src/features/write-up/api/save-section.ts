import { apiClient } from '../../../lib/api-client';
import {
  sectionSummarySchema,
  type SaveSectionRequest,
  type SectionSummary,
} from '../../../../shared/schemas/write-ups';

/** One save of a section's text; a 409 `stale_version` carries the current text in its details. */
export function saveSection(sectionId: number, body: SaveSectionRequest): Promise<SectionSummary> {
  return apiClient.put(`/api/write-up/sections/${sectionId}`, body, { schema: sectionSummarySchema });
}
