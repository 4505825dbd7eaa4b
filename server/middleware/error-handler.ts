import type { ErrorRequestHandler, RequestHandler, Response } from 'express';
import { AppError } from '../errors';
import { uploadError } from './upload';
import { isDatabaseUnavailable } from '../lib/database-errors';

/** Seconds a client is asked to wait before trying again while the database is out of reach. */
const DATABASE_RETRY_AFTER_S = 5;

/** While the database is out of reach every request fails the same way: one log line every few seconds is enough. */
let lastUnavailableLog = 0;
let unavailableSinceLog = 0;
function logUnavailable(error: unknown) {
  unavailableSinceLog++;
  if (Date.now() - lastUnavailableLog < 5_000) return;
  console.error(
    `[database] unavailable, ${unavailableSinceLog} request(s) answered 503 since the last line: ${(error as Error)?.message ?? error}`,
  );
  lastUnavailableLog = Date.now();
  unavailableSinceLog = 0;
}

const statusCodes: Record<number, string> = {
  400: 'bad_request',
  401: 'unauthenticated',
  403: 'forbidden',
  404: 'not_found',
  409: 'conflict',
  413: 'payload_too_large',
  415: 'unsupported_media_type',
  422: 'validation_failed',
  429: 'rate_limited',
};

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError('not_found', 404, `No API route ${req.method} ${req.path}.`));
};

function sendAppError(res: Response, error: AppError) {
  const { code, message, fields, details } = error;
  res.status(error.status).json({ error: { code, message, fields, details } });
}

/** The one place errors become `{ error: { code, message, fields?, details? } }`. */
export const errorHandler: ErrorRequestHandler = (error, _req, res, _next) => {
  if (res.headersSent) return;
  if (error instanceof AppError) return sendAppError(res, error);
  // multer and busboy errors carry no HTTP status: each is mapped to its 4xx (the upload middleware does it with the
  // route's limits in the message; this catches any that reach here another way).
  const fromUpload = uploadError(error);
  if (fromUpload) return sendAppError(res, fromUpload);
  // The database is stopped, restarting or out of reach: a clear 503 the client can retry, not a 500. The server
  // keeps running and the pool opens new connections once the database answers again.
  if (isDatabaseUnavailable(error)) {
    logUnavailable(error);
    res.setHeader('Retry-After', String(DATABASE_RETRY_AFTER_S));
    return sendAppError(
      res,
      new AppError(
        'database_unavailable',
        503,
        'The database cannot be reached just now, so this request was not completed. Try again in a few seconds.',
      ),
    );
  }
  // Errors raised by body parsers carry an HTTP status of their own.
  const status =
    typeof error?.status === 'number' ? error.status : typeof error?.statusCode === 'number' ? error.statusCode : 500;
  if (status >= 400 && status < 500) {
    const code = statusCodes[status] ?? 'bad_request';
    const message =
      error?.type === 'entity.parse.failed'
        ? 'The request body is not valid JSON.'
        : error?.type === 'entity.too.large'
          ? 'The request body is too large.'
          : String(error?.message ?? 'The request was not accepted.');
    res.status(status).json({ error: { code, message } });
    return;
  }
  console.error(error);
  res
    .status(500)
    .json({ error: { code: 'internal_error', message: 'Something went wrong on the server. It has been logged.' } });
};
