import { z } from 'zod';
import type { RegisteredRoute } from './api-registry';
import { apiErrorSchema, roles } from '../shared/schemas/common';

function jsonSchema(schema: z.ZodType, io: 'input' | 'output') {
  return z.toJSONSchema(schema, { io, target: 'draft-2020-12', unrepresentable: 'any' });
}

function rolesFor(route: RegisteredRoute): string[] {
  if (route.access === 'public') return ['anonymous', ...roles];
  if (route.access === 'signed-in') return [...roles];
  return [...route.access];
}

/** The shared error shape with the route's own `details`. */
function errorWithDetails(details: z.ZodType) {
  return z.object({ error: apiErrorSchema.shape.error.extend({ details }) });
}

/**
 * OpenAPI 3.1 (whose schemas are JSON Schema 2020-12) from the same zod schemas the routes validate with.
 * `sessionCookie` is the name the session store sets (`__Host-benchwire_session` on HTTPS, `benchwire_session`
 * otherwise), so the document describes the deployment that serves it.
 */
export function buildOpenApiDocument(routes: RegisteredRoute[], sessionCookie: string) {
  const paths: Record<string, Record<string, unknown>> = {};
  const errorContent = { 'application/json': { schema: jsonSchema(apiErrorSchema, 'output') } };
  for (const route of routes) {
    const openApiPath = route.path.replace(/:(\w+)/g, '{$1}');
    const parameters: unknown[] = [];
    for (const [location, schema] of [
      ['path', route.params],
      ['query', route.query],
    ] as const) {
      if (!schema) continue;
      const object = jsonSchema(schema, 'input') as { properties?: Record<string, unknown>; required?: string[] };
      for (const [name, property] of Object.entries(object.properties ?? {})) {
        parameters.push({
          name,
          in: location,
          required: location === 'path' || !!object.required?.includes(name),
          schema: property,
        });
      }
    }
    for (const match of route.path.matchAll(/:(\w+)/g)) {
      if (!parameters.some((p) => (p as { name: string }).name === match[1])) {
        parameters.push({ name: match[1], in: 'path', required: true, schema: { type: 'string' } });
      }
    }
    const allowed = rolesFor(route);
    const operation: Record<string, unknown> = {
      operationId: `${route.method}_${route.path.replace(/^\/api\//, '').replace(/[^a-zA-Z0-9]+/g, '_')}`,
      summary: route.summary,
      tags: [route.tag],
      description: `Allowed: ${allowed.join(', ')}.`,
      'x-benchwire-roles': allowed,
      security: route.access === 'public' ? [] : [{ sessionCookie: [] }],
      parameters,
      responses: {
        [String(route.successStatus)]: {
          description: 'Success',
          content: route.response
            ? { 'application/json': { schema: jsonSchema(route.response, 'output') } }
            : { [route.produces ?? 'application/json']: {} },
        },
        '400': { description: 'Invalid input', content: errorContent },
        ...(route.access === 'public' ? {} : { '401': { description: 'Not signed in', content: errorContent } }),
        ...(Array.isArray(route.access) ? { '403': { description: 'Role not allowed', content: errorContent } } : {}),
        ...(route.multipart
          ? {
              '413': {
                description: `File or field over the limit (file at most ${route.multipart.limit.maxFileBytes} bytes)`,
                content: errorContent,
              },
              '415': { description: 'Not multipart/form-data', content: errorContent },
            }
          : {}),
        ...Object.fromEntries(
          Object.entries(route.errors ?? {}).map(([status, { description, details }]) => [
            status,
            {
              description,
              content: details
                ? { 'application/json': { schema: jsonSchema(errorWithDetails(details), 'output') } }
                : errorContent,
            },
          ]),
        ),
      },
    };
    // An upload route's body schema checks its form fields; it is a JSON body only when the route says orJson.
    if (route.body && (!route.multipart || route.multipart.orJson)) {
      operation.requestBody = {
        required: true,
        content: { 'application/json': { schema: jsonSchema(route.body, 'input') } },
      };
    }
    if (route.multipart) {
      const properties: Record<string, unknown> = {};
      for (const [name, kind] of Object.entries(route.multipart.fields)) {
        properties[name] =
          kind === 'file'
            ? { type: 'string', contentMediaType: 'application/octet-stream' }
            : { type: 'string', description: kind === 'json' ? 'JSON text' : undefined };
      }
      // Routes with a body schema take either that JSON or the form.
      const json = (operation.requestBody as { content?: Record<string, unknown> } | undefined)?.content ?? {};
      operation.requestBody = {
        required: true,
        content: { ...json, 'multipart/form-data': { schema: { type: 'object', properties } } },
      };
    }
    paths[openApiPath] ??= {};
    paths[openApiPath][route.method] = operation;
  }
  return {
    openapi: '3.1.0',
    info: {
      title: 'Benchwire API',
      version: '1',
      description:
        'JSON API of Benchwire. Sign in with POST /api/auth/sign-in to get the session cookie; every request that changes data must send an Origin header naming this host. Errors are { error: { code, message, fields?, details? } }.',
    },
    components: {
      securitySchemes: { sessionCookie: { type: 'apiKey', in: 'cookie', name: sessionCookie } },
    },
    paths,
  };
}
