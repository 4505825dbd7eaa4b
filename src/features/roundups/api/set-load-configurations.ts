import { apiRequest } from '../../../lib/api-client';
import { roundupDetailSchema, type RoundupDetail } from '../../../../shared/schemas/roundups';
import { useChangeMutation } from '../../../lib/stale-after';

export interface SetLoadConfigurationsInput {
  id: number;
  /** In test order; each is a matrix column. */
  loadConfigurationIds: number[];
}

/** Replaces the ordered load configurations; removing one whose cells hold work is refused (409). */
export function setLoadConfigurations({
  id,
  loadConfigurationIds,
}: SetLoadConfigurationsInput): Promise<RoundupDetail> {
  return apiRequest(`/api/roundups/${id}/load-configurations`, {
    method: 'PUT',
    body: { loadConfigurationIds },
    schema: roundupDetailSchema,
  });
}

export function useSetLoadConfigurations() {
  return useChangeMutation(setLoadConfigurations, 'plan');
}
