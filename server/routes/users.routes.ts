import type { ApiRegistry } from '../api-registry';
import { accountManagers } from '../../shared/access/roles';
import type { AppContext } from '../app-context';
import { noStore } from '../middleware/no-store';
import { idParamSchema } from '../../shared/schemas/common';
import { admitPasswordAttempt } from '../auth/password-guesses';
import { hashInvitationToken } from '../services/invitations.service';
import { sessionResponseSchema } from '../../shared/schemas/auth';
import {
  acceptInvitationRequestSchema,
  createUserRequestSchema,
  invitationSchema,
  invitationTokenParamsSchema,
  updateUserRequestSchema,
  userListSchema,
  userSchema,
} from '../../shared/schemas/users';

export function registerUserRoutes(api: ApiRegistry, { services }: AppContext) {
  const { users, invitations, auth, sessions, passwordGuesses } = services;
  api.router.use('/api/users', noStore);
  api.router.use('/api/invitations', noStore);

  api.add({
    method: 'get',
    path: '/api/users',
    access: accountManagers,
    tag: 'Users',
    summary: 'All staff accounts.',
    response: userListSchema,
    handler: async () => ({ users: await users.list() }),
  });

  api.add({
    method: 'post',
    path: '/api/users',
    access: accountManagers,
    tag: 'Users',
    summary: 'Create a staff account: invited by mail to set their own password, or with a first password.',
    body: createUserRequestSchema,
    response: userSchema,
    handler: ({ user, body }) => users.create(user, body),
  });

  api.add({
    method: 'patch',
    path: '/api/users/:id',
    access: accountManagers,
    tag: 'Users',
    summary: 'Edit, deactivate or reactivate an account, change its role or reset its password.',
    params: idParamSchema,
    body: updateUserRequestSchema,
    response: userSchema,
    handler: ({ user, params, body }) => users.update(user, params.id, body),
  });

  api.add({
    method: 'post',
    path: '/api/users/:id/invitation',
    access: accountManagers,
    tag: 'Users',
    summary: 'Send the invitation again: a new link by mail, the earlier link void.',
    params: idParamSchema,
    response: userSchema,
    successStatus: 200,
    handler: async ({ user, params }) => {
      await invitations.resend(user, params.id);
      return users.get(params.id);
    },
  });

  // The invitation link's token is checked like a password: per token and per client address, in MariaDB.
  const admitToken = (token: string, address: string | undefined, res: Parameters<typeof admitPasswordAttempt>[2]) =>
    admitPasswordAttempt(
      passwordGuesses,
      { check: 'invitation', email: `invitation:${hashInvitationToken(token)}`, address },
      res,
    );

  api.add({
    method: 'get',
    path: '/api/invitations/:token',
    access: 'public',
    tag: 'Users',
    summary: 'Who an open invitation is for (the welcome page).',
    params: invitationTokenParamsSchema,
    response: invitationSchema,
    handler: async ({ params, req, res }) =>
      invitations.lookup(params.token, await admitToken(params.token, req.ip, res)),
  });

  api.add({
    method: 'post',
    path: '/api/invitations/:token/accept',
    access: 'public',
    tag: 'Users',
    summary: 'Accept an invitation: set the first password and sign in (sets the session cookie).',
    params: invitationTokenParamsSchema,
    body: acceptInvitationRequestSchema,
    response: sessionResponseSchema,
    successStatus: 200,
    handler: async ({ params, body, req, res }) => {
      const accepted = await invitations.accept(params.token, body, await admitToken(params.token, req.ip, res));
      const { session, user } = await auth.openSession(
        accepted,
        { userAgent: req.get('user-agent') ?? null, ipAddress: req.ip ?? null },
        sessions.readSessionCookie(req.headers.cookie ?? ''),
      );
      res.append('Set-Cookie', sessions.createSessionCookie(session.id).serialize());
      return { user };
    },
  });
}
