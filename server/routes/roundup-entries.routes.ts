import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { planEditors, planningReaders } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  addRoundupEntryRequestSchema,
  addRoundupEntryResponseSchema,
  entryParamsSchema,
  referenceCandidatesSchema,
  roundupEntryListSchema,
  roundupSuggestionsSchema,
} from '../../shared/schemas/roundups';

export function registerRoundupEntryRoutes(api: ApiRegistry, { services }: AppContext) {
  const entries = services.roundupEntries;

  api.add({
    method: 'get',
    path: '/api/roundups/:id/entries',
    access: planningReaders,
    tag: 'Roundups',
    summary: 'The roundup’s products in order, with price checks against the band and samples.',
    params: idParamSchema,
    response: roundupEntryListSchema,
    handler: async ({ params }) => ({ entries: await entries.list(params.id) }),
  });

  api.add({
    method: 'post',
    path: '/api/roundups/:id/entries',
    access: planEditors,
    tag: 'Roundups',
    summary: 'Add a catalog product (tested, or reference with earlier results); answers with price-band warnings.',
    params: idParamSchema,
    body: addRoundupEntryRequestSchema,
    response: addRoundupEntryResponseSchema,
    handler: ({ user, params, body }) => entries.add(user, params.id, body),
  });

  api.add({
    method: 'delete',
    path: '/api/roundups/:id/entries/:entryId',
    access: planEditors,
    tag: 'Roundups',
    summary: 'Remove a product with its cells and sample (409 entry_has_work once a cell is running or beyond).',
    params: entryParamsSchema,
    successStatus: 204,
    handler: ({ user, params }) => entries.remove(user, params.id, params.entryId),
  });

  api.add({
    method: 'get',
    path: '/api/roundups/:id/suggestions',
    access: planEditors,
    tag: 'Roundups',
    summary: 'Catalog products whose latest price in the band’s region is inside the band (same currency).',
    params: idParamSchema,
    response: roundupSuggestionsSchema,
    handler: ({ params }) => entries.suggestions(params.id),
  });

  api.add({
    method: 'get',
    path: '/api/roundups/:id/reference-candidates',
    access: planEditors,
    tag: 'Roundups',
    summary: 'Products with accepted results in earlier roundups, which can be added as reference entries.',
    params: idParamSchema,
    response: referenceCandidatesSchema,
    handler: async ({ params }) => ({ candidates: await entries.referenceCandidates(params.id) }),
  });
}
