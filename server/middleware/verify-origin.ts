import type { RequestHandler } from 'express';
import { verifyRequestOrigin } from '../auth/session-store';
import { AppError } from '../errors';

const safeMethods = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * CSRF defence: a state-changing request must come from a page of this site, so its Origin header has
 * to name the host the request was sent to (lucia's verifyRequestOrigin pattern). With SameSite=Lax
 * cookies this closes the cross-site form and fetch paths.
 */
export const verifyOrigin: RequestHandler = (req, _res, next) => {
  if (safeMethods.has(req.method)) return next();
  const origin = req.headers.origin;
  // req.host honours X-Forwarded-Host only when "trust proxy" is set.
  const host = req.host;
  if (!origin || !host || !verifyRequestOrigin(origin, [host])) {
    return next(new AppError('cross_site_request', 403, 'This request did not come from a Benchwire page.'));
  }
  next();
};
