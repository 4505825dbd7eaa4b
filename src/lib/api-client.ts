import { z } from 'zod';
import { apiErrorSchema } from '../../shared/schemas/common';

/** An API answer other than 2xx, or no answer at all (status 0), in the server's `{ error }` shape. */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: Record<string, string>;
  /** Seconds to wait before trying again, when the server said so (rate limits). */
  readonly retryAfterSeconds: number | null;
  /**
   * What the server attached beyond the message, e.g. the row-and-column problems of a file it could not read. Read it
   * with the schema of that endpoint's error; it is unknown until then.
   */
  readonly details: unknown;

  constructor(
    status: number,
    code: string,
    message: string,
    fields: Record<string, string> = {},
    { retryAfterSeconds = null, details = null }: { retryAfterSeconds?: number | null; details?: unknown } = {},
  ) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.fields = fields;
    this.retryAfterSeconds = retryAfterSeconds;
    this.details = details;
  }
}

export function isApiError(error: unknown): error is ApiError {
  return error instanceof ApiError;
}

type UnauthorizedHandler = (error: ApiError) => void;
let onUnauthorized: UnauthorizedHandler = () => {};

/**
 * The app decides what a lost session means (it sends the user to the sign-in page); the client only reports it.
 * Kept as a setter so this file does not import the router.
 */
export function setUnauthorizedHandler(handler: UnauthorizedHandler) {
  onUnauthorized = handler;
}

// These answer 401 as part of their normal story (signed out, wrong password): no redirect for them.
const quietUnauthorizedPaths = new Set(['/api/auth/session', '/api/auth/sign-in', '/api/auth/sign-out']);

export interface RequestOptions<T> {
  method?: 'GET' | 'POST' | 'PATCH' | 'PUT' | 'DELETE';
  body?: unknown;
  signal?: AbortSignal;
  /** When given, the response body is checked against it; a mismatch is reported as an error, not passed on. */
  schema?: z.ZodType<T>;
}

const fallbackMessages: Record<number, string> = {
  0: 'Benchwire could not reach the server. Check the connection and try again.',
  403: 'Your role may not do this.',
  404: 'That was not found.',
  413: 'The file is larger than the server accepts.',
  500: 'Something went wrong on the server.',
};

/** No answer at all: the network, not the server. */
export function networkError(): ApiError {
  return new ApiError(0, 'network_error', fallbackMessages[0]);
}

/** A 2xx answer whose body does not match the endpoint's schema. */
export function unexpectedResponseError(status: number): ApiError {
  return new ApiError(status, 'unexpected_response', 'The server sent an answer this page does not understand.');
}

// The shared shape, plus the details an error may carry (kept whatever their shape; the caller reads them).
const errorBodySchema = z.object({
  error: apiErrorSchema.shape.error.extend({ details: z.unknown().optional() }),
});

function parseRetryAfter(header: string | null): number | null {
  if (!header) return null;
  const seconds = Number(header);
  return Number.isFinite(seconds) && seconds >= 0 ? seconds : null;
}

/**
 * Turns a non-2xx answer into an ApiError: the server's `{ error: { code, message, fields?, details? } }` when it sent
 * one, else a plain message for the status. Every request path (fetch and upload) reads errors through this.
 */
export function apiErrorFrom(status: number, body: unknown, retryAfterHeader: string | null = null): ApiError {
  const retryAfterSeconds = parseRetryAfter(retryAfterHeader);
  const parsed = errorBodySchema.safeParse(body);
  if (parsed.success) {
    const { code, message, fields, details } = parsed.data.error;
    return new ApiError(status, code, message, fields ?? {}, {
      retryAfterSeconds,
      details: details ?? null,
    });
  }
  // A proxy or a crashed server may answer with HTML or nothing; the status still tells the story.
  const message = fallbackMessages[status] ?? fallbackMessages[500];
  return new ApiError(status, `http_${status}`, message, {}, { retryAfterSeconds });
}

/** JSON text as the server sent it, or null when it is not JSON. */
export function parseJsonBody(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}

async function readError(response: Response): Promise<ApiError> {
  const body = parseJsonBody(await response.text().catch(() => ''));
  return apiErrorFrom(response.status, body, response.headers.get('retry-after'));
}

/** JSON over fetch, same-origin cookies, one error type. */
export async function apiRequest<T = unknown>(path: string, options: RequestOptions<T> = {}): Promise<T> {
  const { method = 'GET', body, signal, schema } = options;
  const headers: Record<string, string> = { Accept: 'application/json' };
  if (body !== undefined) headers['Content-Type'] = 'application/json';

  let response: Response;
  try {
    response = await fetch(path, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      credentials: 'same-origin',
      signal,
    });
  } catch (error) {
    if (signal?.aborted) throw error;
    throw networkError();
  }

  if (!response.ok) {
    const error = await readError(response);
    if (error.status === 401 && !quietUnauthorizedPaths.has(new URL(path, window.location.origin).pathname)) {
      onUnauthorized(error);
    }
    throw error;
  }

  if (response.status === 204) return undefined as T;
  const data: unknown = await response.json();
  if (!schema) return data as T;
  const checked = schema.safeParse(data);
  if (!checked.success) throw unexpectedResponseError(response.status);
  return checked.data;
}

export const apiClient = {
  get: <T>(path: string, options: Omit<RequestOptions<T>, 'method' | 'body'> = {}) =>
    apiRequest<T>(path, { ...options, method: 'GET' }),
  post: <T>(path: string, body?: unknown, options: Omit<RequestOptions<T>, 'method' | 'body'> = {}) =>
    apiRequest<T>(path, { ...options, method: 'POST', body: body ?? {} }),
  patch: <T>(path: string, body: unknown, options: Omit<RequestOptions<T>, 'method' | 'body'> = {}) =>
    apiRequest<T>(path, { ...options, method: 'PATCH', body }),
  put: <T>(path: string, body: unknown, options: Omit<RequestOptions<T>, 'method' | 'body'> = {}) =>
    apiRequest<T>(path, { ...options, method: 'PUT', body }),
  delete: <T>(path: string, options: Omit<RequestOptions<T>, 'method' | 'body'> = {}) =>
    apiRequest<T>(path, { ...options, method: 'DELETE' }),
};
