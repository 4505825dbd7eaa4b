import { useSuspenseQuery } from '@tanstack/react-query';
import { endpointFieldQueryOptions } from '../../../lib/endpoint-query';
import { createRecord } from '../../../lib/record-requests';
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

export function useCreateLoadConfiguration() {
  return useChangeMutation(
    createRecord<CreateLoadConfigurationRequest, LoadConfiguration>(
      '/api/load-configurations',
      loadConfigurationSchema,
    ),
    'loadConfiguration',
  );
}
