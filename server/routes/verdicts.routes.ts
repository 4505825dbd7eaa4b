import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { editorialDeciders, planningReaders } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  roundupVerdictsSchema,
  setVerdictRequestSchema,
  verdictEntryParamsSchema,
} from '../../shared/schemas/verdicts';

export function registerVerdictRoutes(api: ApiRegistry, { services }: AppContext) {
  const verdicts = services.verdicts;

  api.add({
    method: 'get',
    path: '/api/roundups/:id/verdicts',
    access: planningReaders,
    tag: 'Editorial',
    summary:
      'Each tested product’s verdict (label, best for, price at publication) beside its runs of record’s rubric verdicts.',
    params: idParamSchema,
    response: roundupVerdictsSchema,
    handler: ({ params }) => verdicts.list(params.id),
  });

  api.add({
    method: 'put',
    path: '/api/roundups/:id/verdicts/:entryId',
    access: editorialDeciders,
    tag: 'Editorial',
    summary:
      'Set a product’s verdict; a label that contradicts the rubric verdicts needs a reason (422 reason_required with a field error).',
    params: verdictEntryParamsSchema,
    body: setVerdictRequestSchema,
    response: roundupVerdictsSchema,
    handler: ({ user, params, body }) => verdicts.set(user, params.id, params.entryId, body),
  });
}
