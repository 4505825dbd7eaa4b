import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { planEditors, planningReaders } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  createRoundupRequestSchema,
  roundupDetailSchema,
  roundupHistorySchema,
  roundupListQuerySchema,
  roundupListSchema,
  roundupStateChangeRequestSchema,
  setRoundupLoadConfigurationsRequestSchema,
  updateRoundupRequestSchema,
} from '../../shared/schemas/roundups';

export function registerRoundupRoutes(api: ApiRegistry, { services }: AppContext) {
  const roundups = services.roundups;

  api.add({
    method: 'get',
    path: '/api/roundups',
    access: planningReaders,
    tag: 'Roundups',
    summary: 'Roundups, newest first, with matrix progress and overdue loans; optionally one state.',
    query: roundupListQuerySchema,
    response: roundupListSchema,
    handler: async ({ query }) => ({ roundups: await roundups.list(query) }),
  });

  api.add({
    method: 'post',
    path: '/api/roundups',
    access: planEditors,
    tag: 'Roundups',
    summary: 'Create a roundup in Planning with its band, target date, bench profile and load configurations.',
    body: createRoundupRequestSchema,
    response: roundupDetailSchema,
    handler: ({ user, body }) => roundups.create(user, body),
  });

  api.add({
    method: 'get',
    path: '/api/roundups/:id',
    access: planningReaders,
    tag: 'Roundups',
    summary: 'A roundup with its test plan, entries (price checks, samples) and what blocks the next state.',
    params: idParamSchema,
    response: roundupDetailSchema,
    handler: ({ params }) => roundups.get(params.id),
  });

  api.add({
    method: 'patch',
    path: '/api/roundups/:id',
    access: planEditors,
    tag: 'Roundups',
    summary: 'Edit the title, target date, band, platform, time zone or bench profile.',
    params: idParamSchema,
    body: updateRoundupRequestSchema,
    response: roundupDetailSchema,
    handler: ({ user, params, body }) => roundups.update(user, params.id, body),
  });

  api.add({
    method: 'put',
    path: '/api/roundups/:id/load-configurations',
    access: planEditors,
    tag: 'Roundups',
    summary: 'Set the ordered load configurations (matrix columns); removing one with work is refused (409).',
    params: idParamSchema,
    body: setRoundupLoadConfigurationsRequestSchema,
    response: roundupDetailSchema,
    handler: ({ user, params, body }) => roundups.setLoadConfigurations(user, params.id, body.loadConfigurationIds),
  });

  api.add({
    method: 'post',
    path: '/api/roundups/:id/state',
    access: planEditors,
    tag: 'Roundups',
    summary: 'Move the roundup forward one state (422 state_change_blocked with the reasons when it may not).',
    params: idParamSchema,
    body: roundupStateChangeRequestSchema,
    response: roundupDetailSchema,
    successStatus: 200,
    handler: ({ user, params, body }) => roundups.changeState(user, params.id, body.to),
  });

  api.add({
    method: 'get',
    path: '/api/roundups/:id/history',
    access: planningReaders,
    tag: 'Roundups',
    summary: 'Changes to the roundup and its plan: who, when, what (newest first).',
    params: idParamSchema,
    response: roundupHistorySchema,
    handler: async ({ params }) => ({ entries: await roundups.history(params.id) }),
  });
}
