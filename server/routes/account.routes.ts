import { z } from 'zod';
import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { admitPasswordAttempt } from '../auth/password-guesses';
import { PUBLIC_SESSION_ID_PATTERN } from '../auth/session-store';
import { noStore } from '../middleware/no-store';
import { changePasswordRequestSchema, sessionListSchema } from '../../shared/schemas/auth';
import { okSchema } from '../../shared/schemas/common';

export function registerAccountRoutes(api: ApiRegistry, { services }: AppContext) {
  const { auth, passwordGuesses } = services;
  api.router.use('/api/account', noStore);

  api.add({
    method: 'post',
    path: '/api/account/password',
    access: 'signed-in',
    tag: 'Account',
    summary: 'Change your own password; ends your other sessions.',
    body: changePasswordRequestSchema,
    response: okSchema,
    successStatus: 200,
    handler: async ({ user, session, body, req, res }) => {
      const attempt = await admitPasswordAttempt(
        passwordGuesses,
        { check: 'current-password', email: user.email, address: req.ip },
        res,
      );
      await auth.changePassword(user.id, session.id, body, attempt);
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
    summary: 'Revoke one of your sessions, named by the id the session list gives (never the cookie value).',
    params: z.object({ sessionId: z.string().regex(PUBLIC_SESSION_ID_PATTERN, 'Use an id from your session list.') }),
    response: okSchema,
    handler: async ({ user, params }) => {
      await auth.revokeSession(user.id, params.sessionId);
      return { ok: true as const };
    },
  });
}
