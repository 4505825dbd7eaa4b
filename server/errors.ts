/**
 * The one error type services throw; the error handler turns it into `{ error: { code, message, fields?, details? } }`.
 * `fields` names form fields and what is wrong with each; `details` carries structured data a client shows beside the
 * message (for example the rows and columns of a logger file that could not be read).
 */
export class AppError extends Error {
  constructor(
    readonly code: string,
    readonly status: number,
    message: string,
    readonly fields?: Record<string, string>,
    readonly details?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const notFound = (what: string) => new AppError('not_found', 404, `${what} was not found.`);
export const forbidden = (message = 'Your role may not do this.') => new AppError('forbidden', 403, message);
export const conflict = (code: string, message: string, fields?: Record<string, string>) =>
  new AppError(code, 409, message, fields);
export const invalid = (message: string, fields?: Record<string, string>) =>
  new AppError('validation_failed', 422, message, fields);
