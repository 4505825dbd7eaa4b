import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError } from '../errors';

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

/** The one place errors become `{ error: { code, message, fields? } }`. */
export const errorHandler: ErrorRequestHandler = (error, _req, res, _next) => {
  if (res.headersSent) return;
  if (error instanceof AppError) {
    res.status(error.status).json({ error: { code: error.code, message: error.message, fields: error.fields } });
    return;
  }
  // Errors raised by body parsers and multer carry an HTTP status of their own.
  const status =
    typeof error?.status === 'number' ? error.status : typeof error?.statusCode === 'number' ? error.statusCode : 500;
  if (status >= 400 && status < 500) {
    const code = error?.code === 'LIMIT_FILE_SIZE' ? 'payload_too_large' : (statusCodes[status] ?? 'bad_request');
    const message =
      error?.type === 'entity.parse.failed'
        ? 'The request body is not valid JSON.'
        : error?.type === 'entity.too.large'
          ? 'The request body is too large.'
          : String(error?.message ?? 'The request was not accepted.');
    res.status(error?.code === 'LIMIT_FILE_SIZE' ? 413 : status).json({ error: { code, message } });
    return;
  }
  console.error(error);
  res
    .status(500)
    .json({ error: { code: 'internal_error', message: 'Something went wrong on the server. It has been logged.' } });
};
