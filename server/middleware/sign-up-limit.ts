import { rateLimit } from 'express-rate-limit';
import type { Env } from '../env';
import { AppError } from '../errors';

/** Sign-ups per client address and window, for the form and the JSON API alike (one counter). */
export function signUpLimiter(env: Env) {
  return rateLimit({
    windowMs: env.SUBSCRIBE_WINDOW_MINUTES * 60_000,
    limit: env.SUBSCRIBE_LIMIT_PER_IP,
    standardHeaders: 'draft-7',
    legacyHeaders: false,
    handler: (_req, res, next) => {
      res.setHeader('Retry-After', String(Math.ceil(env.SUBSCRIBE_WINDOW_MINUTES * 60)));
      next(new AppError('rate_limited', 429, 'Too many sign-ups from this address: try again in a few minutes.'));
    },
  });
}
