import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { accountManagers } from '../../shared/access/roles';
import {
  devInboxMessageSchema,
  devInboxParamsSchema,
  devInboxQuerySchema,
  devInboxSchema,
} from '../../shared/schemas/dev-inbox';

export function registerDevInboxRoutes(api: ApiRegistry, { services }: AppContext) {
  api.add({
    method: 'get',
    path: '/api/dev-inbox',
    access: accountManagers,
    tag: 'Mail',
    summary: 'What the local development relay received, newest first; `enabled` is false with a real relay.',
    query: devInboxQuerySchema,
    response: devInboxSchema,
    handler: ({ query }) => services.devInbox.list(query),
  });

  api.add({
    method: 'get',
    path: '/api/dev-inbox/:id',
    access: accountManagers,
    tag: 'Mail',
    summary: 'One message the local relay received: headers, plain text, HTML (inline images as data:) and parts.',
    params: devInboxParamsSchema,
    response: devInboxMessageSchema,
    handler: ({ params }) => services.devInbox.message(params.id),
  });
}
