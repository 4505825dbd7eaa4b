import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { admitPasswordAttempt } from '../auth/password-guesses';
import { noStore } from '../middleware/no-store';
import { sessionResponseSchema, signInRequestSchema } from '../../shared/schemas/auth';
import { okSchema } from '../../shared/schemas/common';

export function registerAuthRoutes(api: ApiRegistry, { services }: AppContext) {
  const { auth, sessions, passwordGuesses } = services;
  api.router.use('/api/auth', noStore);

  api.add({
    method: 'post',
    path: '/api/auth/sign-in',
    access: 'public',
    tag: 'Session',
    summary: 'Sign in with e-mail and password; sets the session cookie.',
    body: signInRequestSchema,
    response: sessionResponseSchema,
    successStatus: 200,
    handler: async ({ body, req, res }) => {
      const attempt = await admitPasswordAttempt(
        passwordGuesses,
        { check: 'sign-in', email: body.email, address: req.ip },
        res,
      );
      const { session, user } = await auth.signIn(
        body,
        { userAgent: req.get('user-agent') ?? null, ipAddress: req.ip ?? null },
        attempt,
        sessions.readSessionCookie(req.headers.cookie ?? ''),
      );
      res.append('Set-Cookie', sessions.createSessionCookie(session.id).serialize());
      return { user };
    },
  });

  api.add({
    method: 'post',
    path: '/api/auth/sign-out',
    access: 'signed-in',
    tag: 'Session',
    summary: 'End the current session.',
    response: okSchema,
    successStatus: 200,
    handler: async ({ session, res }) => {
      await auth.signOut(session.id);
      res.append('Set-Cookie', sessions.createBlankSessionCookie().serialize());
      return { ok: true };
    },
  });

  api.add({
    method: 'get',
    path: '/api/auth/session',
    access: 'signed-in',
    tag: 'Session',
    summary: 'The signed-in user.',
    response: sessionResponseSchema,
    handler: ({ user }) => ({ user }),
  });
}
