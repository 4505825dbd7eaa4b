import { sendInertHtml } from '../lib/inert-html';
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

  api.add({
    method: 'get',
    path: '/api/dev-inbox/:id/html',
    access: accountManagers,
    tag: 'Mail',
    summary:
      'The HTML part of one message as a page of its own (inline images as data:), for the dev inbox frame: its inline styles apply, and nothing in it runs.',
    params: devInboxParamsSchema,
    produces: 'text/html',
    handler: async ({ params, res }) => {
      const message = await services.devInbox.message(params.id);
      // A mail's HTML styles itself inline and carries its images as data:; scripts, forms and requests stay shut.
      sendInertHtml(
        res,
        message.html ?? '<!doctype html><title>No HTML part</title><p>This message has no HTML part.</p>',
        { imgSrc: 'data:', sandbox: 'allow-popups allow-popups-to-escape-sandbox' },
      );
    },
  });
}
