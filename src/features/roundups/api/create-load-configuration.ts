import { apiClient } from '../../../lib/api-client';
import {
  loadConfigurationSchema,
  type CreateLoadConfigurationRequest,
  type LoadConfiguration,
} from '../../../../shared/schemas/load-configurations';
import { useChangeMutation } from '../../../lib/stale-after';

export function createLoadConfiguration(input: CreateLoadConfigurationRequest): Promise<LoadConfiguration> {
  return apiClient.post('/api/load-configurations', input, { schema: loadConfigurationSchema });
}

export function useCreateLoadConfiguration() {
  return useChangeMutation(createLoadConfiguration, 'loadConfiguration');
}
