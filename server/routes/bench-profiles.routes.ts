import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { planEditors, planningReaders } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  benchProfileListQuerySchema,
  benchProfileListSchema,
  benchProfileSchema,
  createBenchProfileRequestSchema,
  updateBenchProfileRequestSchema,
} from '../../shared/schemas/bench-profiles';

export function registerBenchProfileRoutes(api: ApiRegistry, { services }: AppContext) {
  const profiles = services.benchProfiles;

  api.add({
    method: 'get',
    path: '/api/bench-profiles',
    access: planningReaders,
    tag: 'Test plans',
    summary: 'Bench profiles (test systems and conditions), reusable across roundups.',
    query: benchProfileListQuerySchema,
    response: benchProfileListSchema,
    handler: async ({ query }) => ({ benchProfiles: await profiles.list(query) }),
  });

  api.add({
    method: 'post',
    path: '/api/bench-profiles',
    access: planEditors,
    tag: 'Test plans',
    summary: 'Create a bench profile.',
    body: createBenchProfileRequestSchema,
    response: benchProfileSchema,
    handler: ({ user, body }) => profiles.create(user, body),
  });

  api.add({
    method: 'get',
    path: '/api/bench-profiles/:id',
    access: planningReaders,
    tag: 'Test plans',
    summary: 'One bench profile.',
    params: idParamSchema,
    response: benchProfileSchema,
    handler: ({ params }) => profiles.get(params.id),
  });

  api.add({
    method: 'patch',
    path: '/api/bench-profiles/:id',
    access: planEditors,
    tag: 'Test plans',
    summary: 'Edit or archive a bench profile; roundups that use it record the change in their history.',
    params: idParamSchema,
    body: updateBenchProfileRequestSchema,
    response: benchProfileSchema,
    handler: ({ user, params, body }) => profiles.update(user, params.id, body),
  });
}
