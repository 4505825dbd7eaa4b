import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import {
  loadConfigurationSchema,
  type CreateLoadConfigurationRequest,
  type LoadConfiguration,
} from '../../../../shared/schemas/load-configurations';
import { invalidateAfter } from '../../../lib/stale-after';

export function createLoadConfiguration(input: CreateLoadConfigurationRequest): Promise<LoadConfiguration> {
  return apiClient.post('/api/load-configurations', input, { schema: loadConfigurationSchema });
}

export function useCreateLoadConfiguration() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createLoadConfiguration,
    onSuccess: () => invalidateAfter(queryClient, 'loadConfiguration'),
  });
}
