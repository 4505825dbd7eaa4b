import { queryOptions, useSuspenseQuery } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import { useChangeMutation } from '../../../lib/stale-after';
import {
  loadConfigurationListSchema,
  loadConfigurationSchema,
  type CreateLoadConfigurationRequest,
  type LoadConfiguration,
} from '../../../../shared/schemas/load-configurations';
import { roundupKeys } from './roundup-keys';

/** Load configurations that may be chosen (archived ones are left out). */
export async function getLoadConfigurations(signal?: AbortSignal): Promise<LoadConfiguration[]> {
  const { loadConfigurations } = await apiClient.get('/api/load-configurations', {
    signal,
    schema: loadConfigurationListSchema,
  });
  return loadConfigurations;
}

export function loadConfigurationsQueryOptions() {
  return queryOptions({
    queryKey: roundupKeys.item('load-configurations'),
    queryFn: ({ signal }) => getLoadConfigurations(signal),
  });
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
