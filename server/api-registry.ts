import express, { type Request, type Response, type RequestHandler } from 'express';
import { z } from 'zod';
import type { Session } from 'lucia';
import type { CurrentUser } from '../shared/schemas/auth';
import type { Role } from '../shared/schemas/common';
import { AppError } from './errors';
import { acceptUpload, type MultipartSpec } from './middleware/upload';

/** Who may call a route: anyone, any signed-in user, or the listed roles. */
export type Access = 'public' | 'signed-in' | readonly Role[];
type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

export interface RouteContext<B, Q, P> {
  req: Request;
  res: Response;
  body: B;
  query: Q;
  params: P;
  user: CurrentUser | null;
  session: Session | null;
}

/** A signed-in context: handlers of non-public routes can rely on `user`. */
export interface AuthedContext<B, Q, P> extends RouteContext<B, Q, P> {
  user: CurrentUser;
  session: Session;
}

export interface RouteSpec<BS extends z.ZodType, QS extends z.ZodType, PS extends z.ZodType> {
  method: Method;
  /** Full path below the site root, e.g. `/api/users/:id`. */
  path: string;
  access: Access;
  summary: string;
  tag: string;
  body?: BS;
  query?: QS;
  params?: PS;
  response?: z.ZodType;
  /**
   * multipart/form-data routes list their fields and their limits (shared/upload-limits); the registry adds the one
   * upload middleware (server/middleware/upload); `body` then validates the form's text fields.
   */
  multipart?: MultipartSpec;
  /** Error statuses the route answers besides the usual ones, for the OpenAPI document (schema: the `details`). */
  errors?: Record<number, { description: string; details?: z.ZodType }>;
  produces?: string;
  successStatus?: number;
  before?: RequestHandler[];
  handler: (ctx: AuthedContext<z.output<BS>, z.output<QS>, z.output<PS>>) => Promise<unknown> | unknown;
}

export interface RegisteredRoute {
  method: Method;
  path: string;
  access: Access;
  summary: string;
  tag: string;
  body?: z.ZodType;
  query?: z.ZodType;
  params?: z.ZodType;
  response?: z.ZodType;
  multipart?: MultipartSpec;
  errors?: Record<number, { description: string; details?: z.ZodType }>;
  produces?: string;
  successStatus: number;
}

/** The first message per field path; each unknown key is a field of its own, so the reply names it. */
function fieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const key of issue.keys) {
        fields[[...issue.path, key].join('.')] ??= `Unknown field “${key}”: remove it or check its spelling.`;
      }
      continue;
    }
    const key = issue.path.join('.') || '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

function unknownKeys(error: z.ZodError): string[] {
  return error.issues.flatMap((issue) =>
    issue.code === 'unrecognized_keys' ? issue.keys.map((key) => [...issue.path, key].join('.')) : [],
  );
}

export function parseOrThrow<S extends z.ZodType>(schema: S, value: unknown, where: string): z.output<S> {
  const parsed = schema.safeParse(value);
  if (!parsed.success) {
    const unknown = unknownKeys(parsed.error);
    const message =
      unknown.length > 0
        ? `Unknown ${where} field${unknown.length === 1 ? '' : 's'}: ${unknown.join(', ')}.`
        : `Some ${where} values are not valid.`;
    throw new AppError('validation_failed', 400, message, fieldErrors(parsed.error));
  }
  return parsed.data;
}

/** Path ids are plain positive decimal integers: no sign, spaces, leading zeros, hex, exponent or decimal point. */
const plainDecimal = /^[1-9][0-9]{0,14}$/;

/** Names of the path parameters the route's params schema reads as numbers. */
function numericPathParams(params: z.ZodType | undefined): string[] {
  if (!params) return [];
  const schema = z.toJSONSchema(params, { io: 'input', unrepresentable: 'any' }) as {
    properties?: Record<string, { type?: string }>;
  };
  return Object.entries(schema.properties ?? {})
    .filter(([, property]) => property.type === 'integer' || property.type === 'number')
    .map(([name]) => name);
}

function checkPathIds(names: string[], params: Record<string, string>) {
  const fields: Record<string, string> = {};
  for (const name of names) {
    const value = params[name];
    if (value !== undefined && !plainDecimal.test(value)) fields[name] = 'Use a plain whole number above 0, e.g. 42.';
  }
  if (Object.keys(fields).length > 0) {
    throw new AppError('validation_failed', 400, 'Some path values are not valid.', fields);
  }
}

/** True when the request carries a body (a length above zero, or a chunked one). */
function hasBody(req: Request): boolean {
  const length = req.headers['content-length'];
  return (length !== undefined && length !== '0') || req.headers['transfer-encoding'] !== undefined;
}

/**
 * A JSON route takes application/json; an upload route multipart/form-data, and JSON too when it says `orJson`.
 * Anything else is 415 (the upload middleware answers for the forms themselves).
 */
function checkContentType(req: Request, multipart: MultipartSpec | undefined) {
  if (!hasBody(req)) return;
  const accepted = !multipart
    ? ['application/json']
    : multipart.orJson
      ? ['application/json', 'multipart/form-data']
      : ['multipart/form-data'];
  if (req.is(accepted)) return;
  const sent = req.headers['content-type'] ?? 'none';
  throw new AppError(
    'unsupported_media_type',
    415,
    `Send the body as ${accepted.join(' or ')}; this request sent ${sent}.`,
  );
}

export function checkAccess(access: Access, user: CurrentUser | null) {
  if (access === 'public') return;
  if (!user) throw new AppError('unauthenticated', 401, 'Sign in to continue.');
  if (access === 'signed-in') return;
  if (!access.includes(user.role)) throw new AppError('forbidden', 403, 'Your role may not do this.');
}

/**
 * Every API route is declared here with its access rule and schemas, so the role check, the validation
 * and the OpenAPI document come from one declaration.
 */
export class ApiRegistry {
  readonly router = express.Router();
  readonly routes: RegisteredRoute[] = [];

  add<BS extends z.ZodType = z.ZodUnknown, QS extends z.ZodType = z.ZodUnknown, PS extends z.ZodType = z.ZodUnknown>(
    spec: RouteSpec<BS, QS, PS>,
  ) {
    const successStatus = spec.successStatus ?? (spec.method === 'post' ? 201 : 200);
    this.routes.push({ ...spec, successStatus });
    const pathIds = numericPathParams(spec.params);
    const guard: RequestHandler = (req, res, next) => {
      checkAccess(spec.access, res.locals.user ?? null);
      checkPathIds(pathIds, req.params as Record<string, string>);
      if (spec.body || spec.multipart) checkContentType(req, spec.multipart);
      next();
    };
    const handle: RequestHandler = async (req, res) => {
      // The address first: a body's problems mean little while the path names nothing.
      const params = spec.params ? parseOrThrow(spec.params, req.params, 'path') : req.params;
      const query = spec.query ? parseOrThrow(spec.query, req.query, 'query') : req.query;
      const body = spec.body ? parseOrThrow(spec.body, req.body, 'form') : req.body;
      const ctx = {
        req,
        res,
        body,
        query,
        params,
        user: res.locals.user ?? null,
        session: res.locals.session ?? null,
      } as AuthedContext<z.output<BS>, z.output<QS>, z.output<PS>>;
      const result = await spec.handler(ctx);
      if (res.headersSent) return;
      if (result === undefined) res.status(204).end();
      // A handler may set its own status (e.g. 503 from the health check); otherwise the route's success status.
      else res.status(res.statusCode !== 200 ? res.statusCode : successStatus).json(result);
    };
    const upload = spec.multipart ? acceptUpload(spec.multipart) : [];
    this.router[spec.method](spec.path, guard, ...upload, ...(spec.before ?? []), handle);
  }
}
