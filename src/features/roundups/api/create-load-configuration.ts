import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiClient } from '../../../lib/api-client';
import {
  loadConfigurationSchema,
  type CreateLoadConfigurationRequest,
  type LoadConfiguration,
} from '../../../../shared/schemas/load-configurations';
import { roundupKeys } from './roundup-keys';

export function createLoadConfiguration(input: CreateLoadConfigurationRequest): Promise<LoadConfiguration> {
  return apiClient.post('/api/load-configurations', input, { schema: loadConfigurationSchema });
}

export function useCreateLoadConfiguration() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createLoadConfiguration,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: roundupKeys.item('load-configurations') }),
  });
}
