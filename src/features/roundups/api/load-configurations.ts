import { useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { endpointFieldQueryOptions } from '../../../lib/endpoint-query';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  loadConfigurationListSchema,
  loadConfigurationSchema,
  type CreateLoadConfigurationRequest,
  type LoadConfiguration,
} from '../../../../shared/schemas/load-configurations';
import { roundupKeys } from './roundup-keys';

/** Load configurations that may be chosen (archived ones are left out). */
export function loadConfigurationsQueryOptions() {
  return endpointFieldQueryOptions(
    roundupKeys.item('load-configurations'),
    '/api/load-configurations',
    loadConfigurationListSchema,
    'loadConfigurations',
  );
}

export function useLoadConfigurations() {
  return useSuspenseQuery(loadConfigurationsQueryOptions()).data;
}

export function createLoadConfiguration(input: CreateLoadConfigurationRequest): Promise<LoadConfiguration> {
  return apiClient.post('/api/load-configurations', input, { schema: loadConfigurationSchema });
}

export function useCreateLoadConfiguration() {
  return useChangeMutation(createLoadConfiguration, 'loadConfiguration');
}
