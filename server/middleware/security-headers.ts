import helmet from 'helmet';

/**
 * The Content-Security-Policy of every response. Scripts and style sheets come only from this site's own files:
 * no inline script or style, no `eval`, no plugins, no `<base>` tricks, forms post only here, and no other site
 * may frame a page (clickjacking). React sets styles through the DOM (element.style), which a CSP does not
 * restrict, so the staff app needs no 'unsafe-inline'. A server-rendered page that must carry an inline block
 * adds its hash ('sha256-…') to the directive for that response, never 'unsafe-inline'.
 */
export const contentSecurityPolicy = {
  'default-src': ["'self'"],
  'script-src': ["'self'"],
  'script-src-attr': ["'none'"],
  'style-src': ["'self'"],
  'img-src': ["'self'", 'data:', 'blob:'],
  'font-src': ["'self'"],
  'connect-src': ["'self'"],
  'object-src': ["'none'"],
  'base-uri': ["'self'"],
  'form-action': ["'self'"],
  'frame-ancestors': ["'none'"],
} as const;

/**
 * helmet with Benchwire's choices: the CSP above; X-Frame-Options DENY (the older twin of frame-ancestors);
 * nosniff; Referrer-Policy same-origin (links to other sites carry no address of a staff page, while requests to
 * this site keep their Origin header, which the CSRF check reads); HSTS and upgrade-insecure-requests only when
 * the site runs on HTTPS (`secure`), so plain-HTTP local use is not forced onto HTTPS.
 */
export function securityHeaders(secure: boolean) {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        ...contentSecurityPolicy,
        ...(secure ? { 'upgrade-insecure-requests': [] } : {}),
      },
    },
    xFrameOptions: { action: 'deny' },
    referrerPolicy: { policy: 'same-origin' },
    strictTransportSecurity: secure,
  });
}
