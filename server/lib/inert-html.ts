import type { Response } from 'express';

/**
 * Sends a page of HTML in which nothing runs: no scripts, forms, requests or base changes, styles only inline and
 * images only from `imgSrc`; it may be framed by the app alone and is never cached. `sandbox` adds that directive.
 */
export function sendInertHtml(res: Response, html: string, policy: { imgSrc: string; sandbox?: string }) {
  const directives = [
    "default-src 'none'",
    `img-src ${policy.imgSrc}`,
    "style-src 'unsafe-inline'",
    "base-uri 'none'",
    "form-action 'none'",
    "frame-ancestors 'self'",
    ...(policy.sandbox === undefined ? [] : [`sandbox ${policy.sandbox}`]),
  ];
  res.setHeader('Content-Type', 'text/html; charset=utf-8');
  res.setHeader('Content-Security-Policy', directives.join('; '));
  res.setHeader('X-Content-Type-Options', 'nosniff');
  res.setHeader('Cache-Control', 'no-store');
  res.status(200).end(html);
}
