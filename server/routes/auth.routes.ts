import { rateLimit } from 'express-rate-limit';
import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { AppError } from '../errors';
import { sessionResponseSchema, signInRequestSchema } from '../../shared/schemas/auth';
import { okSchema } from '../../shared/schemas/common';

export function registerAuthRoutes(api: ApiRegistry, { services, env }: AppContext) {
  const { auth, sessions } = services;
  const windowMs = env.SIGN_IN_WINDOW_MINUTES * 60_000;
  const tooMany = () => {
    throw new AppError('rate_limited', 429, 'Too many sign-in attempts. Wait a few minutes and try again.');
  };
  const perIp = rateLimit({
    windowMs,
    limit: env.SIGN_IN_LIMIT_PER_IP,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    handler: tooMany,
  });
  // Per account, only failed attempts count, so a colleague on the same network is not locked out.
  const perAccount = rateLimit({
    windowMs,
    limit: env.SIGN_IN_LIMIT_PER_ACCOUNT,
    standardHeaders: false,
    legacyHeaders: false,
    skipSuccessfulRequests: true,
    keyGenerator: (req) =>
      `account:${String(req.body?.email ?? '')
        .trim()
        .toLowerCase()}`,
    handler: tooMany,
  });

  api.add({
    method: 'post',
    path: '/api/auth/sign-in',
    access: 'public',
    tag: 'Session',
    summary: 'Sign in with e-mail and password; sets the session cookie.',
    body: signInRequestSchema,
    response: sessionResponseSchema,
    successStatus: 200,
    before: [perIp, perAccount],
    handler: async ({ body, req, res }) => {
      const { session, user } = await auth.signIn(body, {
        userAgent: req.get('user-agent') ?? null,
        ipAddress: req.ip ?? null,
      });
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
