// The reader's side of subscriptions as server-rendered pages that work without JavaScript: the sign-up form, the
// confirmation step, the self-service page behind the signed link in every mail, and one-click unsubscribe.
//
// One-click unsubscribe (RFC 8058): POST /unsubscribe/:token works without a session and without an Origin header
// (mail programs send it from no page of ours), so it is the one form POST exempt from the Origin check; the signed
// token is the authority. A GET of the same address only shows a page with a button, so link scanners that open
// every link in a mail unsubscribe no one. The answer to the POST is a page, never a redirect (RFC 8058 §3.2).
import { createHash } from 'node:crypto';
import express, { type ErrorRequestHandler, type RequestHandler, type Router } from 'express';
import { AppError } from '../errors';
import { verifyOrigin } from '../middleware/verify-origin';
import type { SubscribersService } from '../services/subscribers.service';
import { signUpRequestSchema, type MailCategory } from '../../shared/schemas/subscribers';
import { escapeHtml as h } from './compose';

const style = `
:root{color-scheme:light;--paper:#FAF8F3;--ink:#1B2433;--muted:#5B6472;--copper:#A4521F;--red:#B42318;--rule:#E4DFD3}
*{box-sizing:border-box}body{margin:0;background:var(--paper);color:var(--ink);font:1rem/1.55 system-ui,sans-serif}
main{max-width:38rem;margin:0 auto;padding:2rem 1.25rem}h1{font-size:1.6rem;line-height:1.2;margin:.25rem 0 1rem}
.eyebrow{color:var(--muted);font-size:.8rem;text-transform:uppercase;letter-spacing:.05em;margin:0}
label{display:block;font-weight:600;margin:.75rem 0 .25rem}input[type=email]{width:100%;padding:.55rem .6rem;font:inherit;border:1px solid #8A8F98;border-radius:3px;background:#fff}
fieldset{border:1px solid var(--rule);border-radius:3px;padding:.5rem 1rem 1rem;margin:1rem 0}legend{font-weight:600;padding:0 .25rem}
.choice{display:flex;gap:.5rem;align-items:flex-start;font-weight:400;margin:.4rem 0}.choice small{display:block;color:var(--muted)}
button{font:inherit;font-weight:600;padding:.55rem 1rem;border-radius:3px;border:1px solid var(--copper);background:var(--copper);color:#fff;cursor:pointer;min-height:2.75rem}
button.secondary{background:#fff;color:var(--ink);border-color:#8A8F98}button.danger{background:#fff;color:var(--red);border-color:var(--red)}
:focus-visible{outline:3px solid var(--copper);outline-offset:2px}.error{color:var(--red)}.note{color:var(--muted);font-size:.9rem}
.summary{border:2px solid var(--red);border-radius:3px;padding:.5rem 1rem;margin:1rem 0}.done{border-left:4px solid var(--copper);padding-left:.75rem}
.trap{position:absolute;left:-10000px;width:1px;height:1px;overflow:hidden}section{border-top:1px solid var(--rule);margin-top:1.5rem;padding-top:.5rem}
a{color:var(--copper)}`;

/** The style block's hash, allowed for these pages alone (the site's CSP has no 'unsafe-inline'). */
const styleSource = `'sha256-${createHash('sha256').update(style).digest('base64')}'`;

function allowStyle(res: express.Response) {
  const policy = res.getHeader('Content-Security-Policy');
  if (typeof policy === 'string') {
    res.setHeader('Content-Security-Policy', policy.replace(/style-src 'self'/, `style-src 'self' ${styleSource}`));
  }
}

function page(title: string, outletName: string, body: string): string {
  return `<!doctype html>
<html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex"><title>${h(title)} · ${h(outletName)}</title><style>${style}</style></head>
<body><main><p class="eyebrow">${h(outletName)}</p>${body}</main></body></html>`;
}

interface FormState {
  email: string;
  categoryIds: number[];
  errors: Record<string, string>;
}

function categoryChoices(categories: MailCategory[], chosen: number[], error?: string) {
  return `<fieldset${error ? ' aria-describedby="categoryIds-error" aria-invalid="true"' : ''}>
<legend>Mail me about</legend>
${error ? `<p id="categoryIds-error" class="error">${h(error)}</p>` : ''}
${categories
  .map(
    (c) =>
      `<label class="choice"><input type="checkbox" name="categoryIds" value="${c.id}"${
        chosen.includes(c.id) ? ' checked' : ''
      }><span>${h(c.name)}${c.description ? `<small>${h(c.description)}</small>` : ''}</span></label>`,
  )
  .join('\n')}
</fieldset>`;
}

function signUpForm(categories: MailCategory[], state: FormState) {
  const errors = Object.entries(state.errors);
  return `<h1>Subscribe to new results</h1>
<p>One e-mail when a roundup of the subjects you choose goes live. We first send a link to confirm the address; nothing else arrives until you open it. Every mail has a one-click unsubscribe.</p>
${
  errors.length
    ? `<div class="summary" role="alert"><p><strong>Please check ${errors.length === 1 ? 'one thing' : `${errors.length} things`}:</strong></p><ul>${errors
        .map(
          ([field, message]) =>
            `<li><a href="#${field === 'categoryIds' ? 'categoryIds-error' : field}">${h(message)}</a></li>`,
        )
        .join('')}</ul></div>`
    : ''
}
<form method="post" action="/subscribe" novalidate>
<label for="email">E-mail address</label>
<input id="email" name="email" type="email" autocomplete="email" required value="${h(state.email)}"${
    state.errors.email ? ' aria-invalid="true" aria-describedby="email-error"' : ''
  }>
${state.errors.email ? `<p id="email-error" class="error">${h(state.errors.email)}</p>` : ''}
${categoryChoices(categories, state.categoryIds, state.errors.categoryIds)}
<div class="trap" aria-hidden="true"><label for="website">Leave this empty</label><input id="website" name="website" type="text" tabindex="-1" autocomplete="off"></div>
<button type="submit">Subscribe</button>
</form>
<p class="note">We keep your address and chosen subjects only to send this mail. You can export or erase them from the link in every message.</p>`;
}

const tokenOf = (req: express.Request) => String(req.params.token);

function asIds(value: unknown): number[] {
  const list = Array.isArray(value) ? value : value === undefined ? [] : [value];
  return list.map((v) => Number(v)).filter((n) => Number.isInteger(n) && n > 0);
}

export interface SubscriberPagesOptions {
  subscribers: SubscribersService;
  outletName: string;
  /** The sign-up rate limit, shared with the JSON API. */
  signUpLimiter: RequestHandler;
}

export function createSubscriberPages({ subscribers, outletName, signUpLimiter }: SubscriberPagesOptions): Router {
  const router = express.Router();
  const form = express.urlencoded({ extended: false, limit: '20kb', parameterLimit: 100 });
  const send = (res: express.Response, status: number, title: string, body: string) => {
    allowStyle(res);
    res
      .status(status)
      .type('html')
      .setHeader('Cache-Control', 'no-store')
      .send(page(title, outletName, body));
  };

  router.get('/subscribe', async (_req, res) => {
    const categories = await subscribers.publicCategories();
    send(res, 200, 'Subscribe', signUpForm(categories, { email: '', categoryIds: [], errors: {} }));
  });

  router.post('/subscribe', verifyOrigin, signUpLimiter, form, async (req, res) => {
    const body = (req.body ?? {}) as Record<string, unknown>;
    const email = typeof body.email === 'string' ? body.email : '';
    const categoryIds = asIds(body.categoryIds);
    const parsed = signUpRequestSchema.safeParse({
      email,
      categoryIds,
      website: typeof body.website === 'string' ? body.website : undefined,
    });
    const categories = await subscribers.publicCategories();
    if (!parsed.success) {
      const errors: Record<string, string> = {};
      for (const issue of parsed.error.issues) errors[String(issue.path[0] ?? 'email')] ??= issue.message;
      return send(res, 422, 'Subscribe', signUpForm(categories, { email, categoryIds, errors }));
    }
    try {
      const answer = await subscribers.signUp(parsed.data);
      send(
        res,
        200,
        'Check your inbox',
        `<h1>Check your inbox</h1><p class="done" role="status">${h(answer.message)}</p>`,
      );
    } catch (error) {
      if (error instanceof AppError && error.fields) {
        return send(res, 422, 'Subscribe', signUpForm(categories, { email, categoryIds, errors: error.fields }));
      }
      throw error;
    }
  });

  router.get('/subscribe/confirm/:token', async (req, res) => {
    const token = tokenOf(req);
    if (!(await subscribers.confirmationOpen(token))) {
      return send(
        res,
        410,
        'Link used or expired',
        `<h1>This link has been used or has expired</h1><p>If you have not confirmed yet, <a href="/subscribe">sign up again</a> for a new link.</p>`,
      );
    }
    send(
      res,
      200,
      'Confirm your subscription',
      `<h1>Confirm your subscription</h1><p>Press the button to start receiving mail about the subjects you chose.</p>
<form method="post" action="/subscribe/confirm/${h(encodeURIComponent(token))}"><button type="submit">Confirm my subscription</button></form>`,
    );
  });

  router.post('/subscribe/confirm/:token', verifyOrigin, async (req, res) => {
    const manage = await subscribers.confirm(tokenOf(req));
    send(
      res,
      200,
      'Subscribed',
      `<h1>You are subscribed</h1><p class="done" role="status">Thank you: the next roundup on your subjects arrives by mail.</p>
<p><a href="/subscribe/manage/${h(manage)}">Your subscription</a>: subjects, your data, unsubscribe. The same link is in every mail.</p>`,
    );
  });

  const managePage = async (token: string, notice = '', errors: Record<string, string> = {}) => {
    const view = await subscribers.view(token);
    if (!view) return null;
    const categories = await subscribers.publicCategories();
    const path = `/subscribe/manage/${encodeURIComponent(token)}`;
    const s = view.subscriber;
    const status =
      s.status === 'confirmed'
        ? 'You are subscribed.'
        : s.status === 'pending'
          ? 'Not confirmed yet: open the link in the confirmation mail.'
          : 'You are unsubscribed: no mailings are sent to this address.';
    return `<h1>Your subscription</h1>
${notice ? `<p class="done" role="status">${h(notice)}</p>` : ''}
<p><strong>${h(s.email)}</strong> — ${h(status)}</p>
<form method="post" action="${h(path)}">
${categoryChoices(categories, view.categoryIds, errors.categoryIds)}
<button type="submit">Save subjects</button>
</form>
<section><h2>Your data</h2><p><a href="${h(path)}/export.json" download>Download everything we keep about you (JSON)</a></p></section>
${
  s.status !== 'unsubscribed'
    ? `<section><h2>Unsubscribe</h2><form method="post" action="/unsubscribe/${h(encodeURIComponent(token))}"><input type="hidden" name="List-Unsubscribe" value="One-Click"><button type="submit" class="secondary">Unsubscribe</button></form></section>`
    : ''
}
<section><h2>Erase</h2><p>Removes your address and everything with it. Only a one-way, salted fingerprint of the address stays, so it is never mailed again by mistake.</p>
<form method="post" action="${h(path)}/erase"><label class="choice"><input type="checkbox" name="confirm" value="yes" required> I understand this cannot be undone</label>
${errors.confirm ? `<p class="error" role="alert">${h(errors.confirm)}</p>` : ''}
<button type="submit" class="danger">Erase my data</button></form></section>`;
  };
  const linkGone = (res: express.Response) =>
    send(
      res,
      404,
      'Link not valid',
      '<h1>This link does not open a subscription</h1><p>It may be mistyped, or the subscription was erased. <a href="/subscribe">Subscribe again</a>.</p>',
    );

  router.get('/subscribe/manage/:token', async (req, res) => {
    const body = await managePage(tokenOf(req));
    if (!body) return linkGone(res);
    send(res, 200, 'Your subscription', body);
  });

  router.post('/subscribe/manage/:token', verifyOrigin, form, async (req, res) => {
    try {
      await subscribers.updatePreferences(tokenOf(req), asIds((req.body ?? {}).categoryIds));
    } catch (error) {
      if (error instanceof AppError && error.status === 422) {
        const body = await managePage(tokenOf(req), '', error.fields ?? {});
        if (body) return send(res, 422, 'Your subscription', body);
      }
      if (error instanceof AppError && error.status === 404) return linkGone(res);
      throw error;
    }
    send(res, 200, 'Your subscription', (await managePage(tokenOf(req), 'Saved.')) ?? '');
  });

  router.get('/subscribe/manage/:token/export.json', async (req, res) => {
    const data = await subscribers.export(tokenOf(req));
    res
      .status(200)
      .setHeader('Cache-Control', 'no-store')
      .setHeader('Content-Disposition', 'attachment; filename="my-subscription.json"')
      .json(data);
  });

  router.post('/subscribe/manage/:token/erase', verifyOrigin, form, async (req, res) => {
    if ((req.body ?? {}).confirm !== 'yes') {
      const body = await managePage(tokenOf(req), '', { confirm: 'Tick the box to confirm the erasure.' });
      if (!body) return linkGone(res);
      return send(res, 422, 'Your subscription', body);
    }
    await subscribers.erase(tokenOf(req));
    send(
      res,
      200,
      'Erased',
      '<h1>Erased</h1><p class="done" role="status">Your address and subscription are gone.</p>',
    );
  });

  router.get('/unsubscribe/:token', async (req, res) => {
    const view = await subscribers.view(tokenOf(req));
    if (!view) return linkGone(res);
    send(
      res,
      200,
      'Unsubscribe',
      `<h1>Unsubscribe?</h1><p>No more mailings will go to <strong>${h(view.subscriber.email)}</strong>.</p>
<form method="post" action="/unsubscribe/${h(encodeURIComponent(tokenOf(req)))}"><input type="hidden" name="List-Unsubscribe" value="One-Click"><button type="submit">Unsubscribe</button></form>
<p class="note"><a href="/subscribe/manage/${h(encodeURIComponent(tokenOf(req)))}">Change subjects instead</a></p>`,
    );
  });

  // RFC 8058 one-click: no session, no Origin, no CSRF token; the body is `List-Unsubscribe=One-Click`
  // (form-encoded or multipart) and is not needed beyond the signed token in the address.
  router.post('/unsubscribe/:token', async (req, res) => {
    const done = await subscribers.unsubscribe(tokenOf(req));
    if (!done) return linkGone(res);
    send(
      res,
      200,
      'Unsubscribed',
      `<h1>You are unsubscribed</h1><p class="done" role="status">No more mailings will be sent to this address.</p>
<p><a href="/subscribe/manage/${h(encodeURIComponent(tokenOf(req)))}">Your data, or subscribe again</a></p>`,
    );
  });

  const pageErrors: ErrorRequestHandler = (error, _req, res, next) => {
    if (res.headersSent) return next(error);
    if (error instanceof AppError) {
      const title =
        error.status === 429 ? 'Too many tries' : error.status === 410 ? 'Link used or expired' : 'Something is wrong';
      return send(
        res,
        error.status,
        title,
        `<h1>${h(title)}</h1><p>${h(error.message)}</p><p><a href="/subscribe">Subscribe</a></p>`,
      );
    }
    next(error);
  };
  router.use(pageErrors);
  return router;
}
