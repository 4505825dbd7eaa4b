import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { benchWorkers, planningReaders } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  sampleListSchema,
  sampleParamsSchema,
  sampleSchema,
  updateSampleRequestSchema,
} from '../../shared/schemas/samples';

export function registerSampleRoutes(api: ApiRegistry, { services }: AppContext) {
  const samples = services.samples;

  api.add({
    method: 'get',
    path: '/api/roundups/:id/samples',
    access: planningReaders,
    tag: 'Samples',
    summary: 'Sample records of the roundup’s tested products, with overdue loans flagged in the roundup’s zone.',
    params: idParamSchema,
    response: sampleListSchema,
    handler: ({ params }) => samples.list(params.id),
  });

  api.add({
    method: 'patch',
    path: '/api/roundups/:id/samples/:sampleId',
    access: benchWorkers,
    tag: 'Samples',
    summary: 'Update a sample record (source, dates, serial, condition, firmware, status).',
    params: sampleParamsSchema,
    body: updateSampleRequestSchema,
    response: sampleSchema,
    handler: ({ params, user, body }) => samples.update(user, params.id, params.sampleId, body),
  });
}
