import { z } from 'zod';
import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { changePasswordRequestSchema, sessionListSchema } from '../../shared/schemas/auth';
import { okSchema } from '../../shared/schemas/common';

export function registerAccountRoutes(api: ApiRegistry, { services }: AppContext) {
  const auth = services.auth;

  api.add({
    method: 'post',
    path: '/api/account/password',
    access: 'signed-in',
    tag: 'Account',
    summary: 'Change your own password; ends your other sessions.',
    body: changePasswordRequestSchema,
    response: okSchema,
    successStatus: 200,
    handler: async ({ user, session, body }) => {
      await auth.changePassword(user.id, session.id, body);
      return { ok: true as const };
    },
  });

  api.add({
    method: 'get',
    path: '/api/account/sessions',
    access: 'signed-in',
    tag: 'Account',
    summary: 'Your open sessions.',
    response: sessionListSchema,
    handler: async ({ user, session }) => ({ sessions: await auth.listSessions(user.id, session.id) }),
  });

  api.add({
    method: 'delete',
    path: '/api/account/sessions/:sessionId',
    access: 'signed-in',
    tag: 'Account',
    summary: 'Revoke one of your sessions.',
    params: z.object({ sessionId: z.string().min(1).max(64) }),
    response: okSchema,
    handler: async ({ user, params }) => {
      await auth.revokeSession(user.id, params.sessionId);
      return { ok: true as const };
    },
  });
}
