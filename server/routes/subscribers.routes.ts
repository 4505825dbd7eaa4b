import { timingSafeEqual } from 'node:crypto';
import { z } from 'zod';
import type { ApiRegistry } from '../api-registry';
import type { AppContext } from '../app-context';
import { AppError } from '../errors';
import { planEditors, planningReaders, staff } from '../../shared/access/roles';
import { idParamSchema } from '../../shared/schemas/common';
import {
  confirmRequestSchema,
  createMailingRequestSchema,
  mailCategoryInputSchema,
  mailCategoryListSchema,
  mailCategorySchema,
  mailEventsRequestSchema,
  mailPreferencesSchema,
  roundupMailingsSchema,
  signUpAnswerSchema,
  signUpRequestSchema,
  staffMailCategoryListSchema,
  updateMailPreferencesSchema,
} from '../../shared/schemas/subscribers';

function sameSecret(given: string | undefined, expected: string): boolean {
  const a = Buffer.from(given ?? '');
  const b = Buffer.from(expected);
  return a.length === b.length && timingSafeEqual(a, b);
}

export function registerSubscriberRoutes(api: ApiRegistry, { services, env }: AppContext) {
  const { subscribers, staffMail } = services;

  api.add({
    method: 'get',
    path: '/api/mail-categories',
    access: 'public',
    tag: 'Subscribers',
    summary: 'The subjects readers can subscribe to.',
    response: mailCategoryListSchema,
    handler: async () => ({ categories: await subscribers.publicCategories() }),
  });

  api.add({
    method: 'post',
    path: '/api/subscribers',
    access: 'public',
    tag: 'Subscribers',
    summary:
      'Sign up for mail (double opt-in): the answer is the same whether or not the address is known; rate-limited per client address.',
    body: signUpRequestSchema,
    response: signUpAnswerSchema,
    successStatus: 202,
    before: [services.signUpLimiter],
    handler: ({ body }) => subscribers.signUp(body),
  });

  api.add({
    method: 'post',
    path: '/api/subscribers/confirm',
    access: 'public',
    tag: 'Subscribers',
    summary: 'Confirm a sign-up with the token from the confirmation mail: works once, until it expires.',
    body: confirmRequestSchema,
    response: z.object({ managePath: z.string() }),
    successStatus: 200,
    handler: async ({ body }) => ({ managePath: `/subscribe/manage/${await subscribers.confirm(body.token)}` }),
  });

  api.add({
    method: 'get',
    path: '/api/subscriber-categories',
    access: planningReaders,
    tag: 'Subscribers',
    summary: 'The subjects readers can subscribe to, with confirmed subscribers per subject and totals by status.',
    response: staffMailCategoryListSchema,
    handler: () => subscribers.staffCategories(),
  });

  api.add({
    method: 'post',
    path: '/api/subscriber-categories',
    access: planEditors,
    tag: 'Subscribers',
    summary: 'Add a subject; a roundup belongs to it when its product class and platform match (empty: any).',
    body: mailCategoryInputSchema,
    response: mailCategorySchema,
    handler: ({ user, body }) => subscribers.saveCategory(user, null, body),
  });

  api.add({
    method: 'patch',
    path: '/api/subscriber-categories/:id',
    access: planEditors,
    tag: 'Subscribers',
    summary: 'Rename or re-match a subject.',
    params: idParamSchema,
    body: mailCategoryInputSchema,
    response: mailCategorySchema,
    handler: ({ user, params, body }) => subscribers.saveCategory(user, params.id, body),
  });

  api.add({
    method: 'delete',
    path: '/api/subscriber-categories/:id',
    access: planEditors,
    tag: 'Subscribers',
    summary: 'Remove a subject; subscribers keep their other subjects.',
    params: idParamSchema,
    successStatus: 204,
    handler: ({ user, params }) => subscribers.deleteCategory(user, params.id),
  });

  api.add({
    method: 'get',
    path: '/api/roundups/:id/mailings',
    access: planEditors,
    tag: 'Subscribers',
    summary: 'The roundup’s mailings with their progress: queued, sending, sent, deferred, failed, suppressed.',
    params: idParamSchema,
    response: roundupMailingsSchema,
    handler: ({ params }) => subscribers.roundupMailings(params.id),
  });

  api.add({
    method: 'post',
    path: '/api/roundups/:id/mailings',
    access: planEditors,
    tag: 'Subscribers',
    summary: 'Mail an update or a correction of a live roundup to its subscribers (never sent without this choice).',
    params: idParamSchema,
    body: createMailingRequestSchema,
    response: roundupMailingsSchema,
    handler: ({ user, params, body }) => subscribers.createMailing(user, params.id, body.kind, body.note),
  });

  api.add({
    method: 'post',
    path: '/api/roundups/:id/mailings/test',
    access: planEditors,
    tag: 'Subscribers',
    summary: 'Send the roundup’s go-live mail to yourself first.',
    params: idParamSchema,
    response: z.object({ sentTo: z.string() }),
    successStatus: 202,
    handler: ({ user, params }) => subscribers.sendTest(user, params.id),
  });

  api.add({
    method: 'get',
    path: '/api/account/mail',
    access: staff,
    tag: 'Account',
    summary: 'Which kinds of reminder mail you receive.',
    response: mailPreferencesSchema,
    handler: ({ user }) => staffMail.preferences(user),
  });

  api.add({
    method: 'put',
    path: '/api/account/mail',
    access: staff,
    tag: 'Account',
    summary: 'Turn kinds of reminder mail off (the ones listed) or back on (the ones left out).',
    body: updateMailPreferencesSchema,
    response: mailPreferencesSchema,
    handler: ({ user, body }) => staffMail.updatePreferences(user, body.disabled),
  });

  api.add({
    method: 'post',
    path: '/api/mail/events',
    // A real relay calls this, with the shared secret MAIL_WEBHOOK_SECRET in the X-Benchwire-Webhook-Secret header.
    access: 'public',
    tag: 'Subscribers',
    summary: 'Bounces and complaints from the mail relay (shared secret in X-Benchwire-Webhook-Secret).',
    body: mailEventsRequestSchema,
    response: z.object({ received: z.number().int(), suppressed: z.number().int() }),
    successStatus: 200,
    handler: ({ req, body }) => {
      if (!env.MAIL_WEBHOOK_SECRET) throw new AppError('not_found', 404, 'No mail webhook is configured.');
      if (!sameSecret(req.get('x-benchwire-webhook-secret'), env.MAIL_WEBHOOK_SECRET)) {
        throw new AppError('webhook_secret_wrong', 401, 'The webhook secret is missing or wrong.');
      }
      return subscribers.recordEvents(body.events);
    },
  });
}
