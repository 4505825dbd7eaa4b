import type { RequestHandler } from 'express';

/** Answers about sessions and accounts must not be kept by the browser or any cache on the way. */
export const noStore: RequestHandler = (_req, res, next) => {
  res.set('Cache-Control', 'no-store');
  next();
};
