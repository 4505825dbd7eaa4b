import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { planEditors, planningReaders } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  createLoadConfigurationRequestSchema,
  loadConfigurationListQuerySchema,
  loadConfigurationListSchema,
  loadConfigurationSchema,
  updateLoadConfigurationRequestSchema,
} from '../../shared/schemas/load-configurations';

export function registerLoadConfigurationRoutes(api: ApiRegistry, { services }: AppContext) {
  const configurations = services.loadConfigurations;

  api.add({
    method: 'get',
    path: '/api/load-configurations',
    access: planningReaders,
    tag: 'Test plans',
    summary: 'Load configurations (CPU, settings, expected load), reusable across roundups.',
    query: loadConfigurationListQuerySchema,
    response: loadConfigurationListSchema,
    handler: async ({ query }) => ({ loadConfigurations: await configurations.list(query) }),
  });

  api.add({
    method: 'post',
    path: '/api/load-configurations',
    access: planEditors,
    tag: 'Test plans',
    summary: 'Create a load configuration.',
    body: createLoadConfigurationRequestSchema,
    response: loadConfigurationSchema,
    handler: ({ user, body }) => configurations.create(user, body),
  });

  api.add({
    method: 'get',
    path: '/api/load-configurations/:id',
    access: planningReaders,
    tag: 'Test plans',
    summary: 'One load configuration.',
    params: idParamSchema,
    response: loadConfigurationSchema,
    handler: ({ params }) => configurations.get(params.id),
  });

  api.add({
    method: 'patch',
    path: '/api/load-configurations/:id',
    access: planEditors,
    tag: 'Test plans',
    summary: 'Edit or archive a load configuration; roundups that use it record the change in their history.',
    params: idParamSchema,
    body: updateLoadConfigurationRequestSchema,
    response: loadConfigurationSchema,
    handler: ({ user, params, body }) => configurations.update(user, params.id, body),
  });
}
