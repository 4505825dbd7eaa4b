import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { editorialDeciders, planningReaders, reviewRequesters } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  cellExclusionParamsSchema,
  excludeCellRequestSchema,
  readinessSchema,
  reviewRequestSchema,
} from '../../shared/schemas/readiness';
import { roundupDetailSchema } from '../../shared/schemas/roundups';

export function registerReadinessRoutes(api: ApiRegistry, { services }: AppContext) {
  const readiness = services.readiness;

  api.add({
    method: 'get',
    path: '/api/roundups/:id/readiness',
    access: planningReaders,
    tag: 'Editorial',
    summary:
      'Whether the roundup is ready to schedule, and what still blocks it, each with the screen where it is fixed.',
    params: idParamSchema,
    response: readinessSchema,
    handler: ({ params, user }) => readiness.readiness(params.id, user),
  });

  api.add({
    method: 'post',
    path: '/api/roundups/:id/review-request',
    access: reviewRequesters,
    tag: 'Editorial',
    summary: 'Send a roundup from Writing to In review (writer or editor).',
    params: idParamSchema,
    body: reviewRequestSchema,
    response: roundupDetailSchema,
    successStatus: 200,
    handler: ({ user, params }) => readiness.requestReview(user, params.id),
  });

  api.add({
    method: 'put',
    path: '/api/roundups/:id/cells/:cellId/exclusion',
    access: editorialDeciders,
    tag: 'Editorial',
    summary: 'Leave a matrix cell out of the roundup, with a reason (reversible, audited).',
    params: cellExclusionParamsSchema,
    body: excludeCellRequestSchema,
    response: readinessSchema,
    handler: ({ user, params, body }) => readiness.excludeCell(user, params.id, params.cellId, body.reason),
  });

  api.add({
    method: 'delete',
    path: '/api/roundups/:id/cells/:cellId/exclusion',
    access: editorialDeciders,
    tag: 'Editorial',
    summary: 'Take a left-out matrix cell back into the roundup.',
    params: cellExclusionParamsSchema,
    response: readinessSchema,
    handler: ({ user, params }) => readiness.includeCell(user, params.id, params.cellId),
  });
}
