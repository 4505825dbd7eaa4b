import { beforeAll, describe, expect, it, vi } from 'vitest';
import { client, signedIn, testApp, testDataSource, type Client, type TestApp } from './support/test-app';
import { roles } from '../../shared/schemas/common';
import { bodyWith } from '../support/request-bodies';

/**
 * The input rules, checked on every route the OpenAPI document lists: each text field, date field, body and path
 * id the document declares gets the probes below. A new route or field is covered without writing a test.
 *
 * Character classes are from the Unicode Standard: U+D800 is a high surrogate with no low surrogate after it
 * (ill-formed UTF-16, Unicode 15 §3.9 D91); U+0007 is a C0 control; U+202E (RIGHT-TO-LEFT OVERRIDE) and U+2066
 * (LEFT-TO-RIGHT ISOLATE) are the bidirectional controls Unicode Technical Report #36 §2.4 warns about.
 */

interface JsonSchema {
  type?: string | string[];
  format?: string;
  properties?: Record<string, JsonSchema>;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
  items?: JsonSchema;
  enum?: unknown[];
  'x-text'?: 'single-line' | 'multi-line' | 'password';
  additionalProperties?: unknown;
}

interface Operation {
  parameters?: { name: string; in: string; schema: JsonSchema }[];
  requestBody?: { content: Record<string, { schema: JsonSchema }> };
  'x-benchwire-roles': string[];
}

interface Route {
  method: string;
  path: string;
  operation: Operation;
}

interface Field {
  path: string[];
  schema: JsonSchema;
}

/** The schema's alternatives flattened (nullable fields are anyOf [T, null]). */
function variants(schema: JsonSchema): JsonSchema[] {
  const options = schema.anyOf ?? schema.oneOf ?? schema.allOf;
  return options ? options.flatMap(variants) : [schema];
}

function walk(schema: JsonSchema, path: string[], strings: Field[], objects: Field[]) {
  for (const variant of variants(schema)) {
    if (variant.type === 'string') strings.push({ path, schema: variant });
    if (variant.type === 'object' && variant.properties) {
      objects.push({ path, schema: variant });
      for (const [name, property] of Object.entries(variant.properties))
        walk(property, [...path, name], strings, objects);
    }
  }
}

function bodyFields(operation: Operation) {
  const schema = operation.requestBody?.content['application/json']?.schema;
  const strings: Field[] = [];
  const objects: Field[] = [];
  if (schema) walk(schema, [], strings, objects);
  return { strings, objects };
}

const ids = { id: '1' };
function concretePath(path: string, overrides: Record<string, string> = {}) {
  return path.replace(/\{(\w+)\}/g, (_, name: string) => overrides[name] ?? ids.id);
}

// Hundreds of requests per test: room for a busy machine.
vi.setConfig({ testTimeout: 300_000, hookTimeout: 120_000 });

let app: TestApp;
let routes: Route[];
const agents = new Map<string, Client>();

/** A caller the route admits (an editor where possible), so the probes reach validation rather than 403. */
function callerFor(route: Route): Client {
  const allowed = route.operation['x-benchwire-roles'];
  const role = ['editor', 'tester', 'admin', 'writer'].find((r) => allowed.includes(r));
  return role ? agents.get(role)! : client(app);
}

function send(route: Route, path: string, body?: unknown, contentType?: string) {
  const agent = callerFor(route);
  const request = (agent as unknown as Record<string, (url: string) => ReturnType<Client['post']>>)[route.method](path);
  if (body === undefined) return request;
  if (contentType) return request.set('Content-Type', contentType).send(body as string);
  return request.send(body as object);
}

beforeAll(async () => {
  // Generous sign-in limits: these probes send many bodies to the sign-in route on purpose.
  app = await testApp({ SIGN_IN_LIMIT_PER_IP: '100000', SIGN_IN_LIMIT_PER_ACCOUNT: '100000' } as never);
  for (const role of roles) agents.set(role, (await signedIn(app, role)).agent);
  const document = (await client(app).get('/api/openapi.json')).body as {
    paths: Record<string, Record<string, Operation>>;
  };
  routes = Object.entries(document.paths).flatMap(([path, operations]) =>
    Object.entries(operations).map(([method, operation]) => ({ method, path, operation })),
  );
});

/**
 * Sends `value` in every query parameter of a GET route whose schema has a variant `picks` accepts; each answer must
 * be 400 naming the parameter. How many parameters were tried.
 */
async function refusedInQueries(picks: (schema: JsonSchema) => boolean, value: string): Promise<number> {
  let checked = 0;
  for (const route of routes.filter((r) => r.method === 'get')) {
    for (const parameter of route.operation.parameters ?? []) {
      if (parameter.in !== 'query' || !variants(parameter.schema).some(picks)) continue;
      const response = await send(route, `${concretePath(route.path)}?${parameter.name}=${encodeURIComponent(value)}`);
      expect(response.status, `${route.path} ?${parameter.name}`).toBe(400);
      expect(response.body.error.fields).toHaveProperty([parameter.name]);
      checked += 1;
    }
  }
  return checked;
}

/** The reply names the field, or the nearest enclosing field when the field sits in a choice of shapes. */
function expectNamed(fields: Record<string, string> | undefined, path: string[], label: string) {
  const name = path.join('.');
  const named = Object.keys(fields ?? {}).some((key) => key === name || (key !== '' && name.startsWith(`${key}.`)));
  expect(named, `${label}: ${JSON.stringify(fields)}`).toBe(true);
}

const fieldLabel = (route: Route, field: Field) =>
  `${route.method.toUpperCase()} ${route.path} ${field.path.join('.')}`;

describe('text fields of every route', () => {
  const probes: [string, string][] = [
    ['a lone surrogate', 'Board \uD800 name'],
    ['a control character', 'Board \u0007 name'],
    ['a right-to-left override', 'Board \u202E name'],
    ['a left-to-right isolate', 'Board \u2066 name'],
    ['a replacement character', 'Board \uFFFD name'],
  ];

  it('when a body field holds ill-formed or hidden characters, then the answer is 400 naming that field', async () => {
    const checked: string[] = [];
    for (const route of routes) {
      for (const field of bodyFields(route.operation).strings) {
        for (const [, value] of probes) {
          const response = await send(route, concretePath(route.path), bodyWith(field.path, value));
          expect(response.status, `${fieldLabel(route, field)}: ${JSON.stringify(value)}`).toBe(400);
          expectNamed(response.body.error.fields, field.path, fieldLabel(route, field));
        }
        checked.push(fieldLabel(route, field));
      }
    }
    // The document lists text fields at all (a broken walk would pass vacuously).
    expect(checked.length).toBeGreaterThan(40);
  });

  it('when a one-line field gets a line break, or a password only spaces, then the answer is 400 naming it', async () => {
    let singleLine = 0;
    for (const route of routes) {
      for (const field of bodyFields(route.operation).strings) {
        const kind = field.schema['x-text'];
        if (kind !== 'single-line' && kind !== 'password') continue;
        const value = kind === 'password' ? ' '.repeat(16) : 'first line\nsecond line';
        const response = await send(route, concretePath(route.path), bodyWith(field.path, value));
        expect(response.status, fieldLabel(route, field)).toBe(400);
        expectNamed(response.body.error.fields, field.path, fieldLabel(route, field));
        singleLine += 1;
      }
    }
    expect(singleLine).toBeGreaterThan(20);
  });

  it('when a query text holds a bidirectional override, then the answer is 400 naming the parameter', async () => {
    expect(await refusedInQueries((s) => s.type === 'string', 'x\u202Ey')).toBeGreaterThan(5);
  });
});

describe('date fields of every route', () => {
  // Years 0000–0099 were read back as 1900–1999; 0100 and 9999 are implausible for every kind of date here; the
  // last instant is year 10000 once in UTC.
  const badDates = ['0000-01-01', '0050-03-04', '0099-12-31', '0100-01-01', '9999-12-31', '2025-02-30', '2025-13-01'];
  const badInstants = [
    '9999-12-31T23:00:00-05:00',
    '0050-03-04T10:00:00Z',
    '0100-01-01T00:00:00Z',
    '2025-02-30T10:00:00Z',
    '2025-06-02T25:00:00Z',
    '2025-06-02T10:00:00',
  ];

  it('when a date or instant is out of its range or does not exist, then the answer is 400 naming the field', async () => {
    let checked = 0;
    for (const route of routes) {
      for (const field of bodyFields(route.operation).strings) {
        const format = field.schema.format;
        if (format !== 'date' && format !== 'date-time') continue;
        for (const value of format === 'date' ? badDates : badInstants) {
          const response = await send(route, concretePath(route.path), bodyWith(field.path, value));
          expect(response.status, `${fieldLabel(route, field)} = ${value}`).toBe(400);
          expect(response.body.error.fields, `${fieldLabel(route, field)} = ${value}`).toHaveProperty([
            field.path.join('.'),
          ]);
        }
        checked += 1;
      }
    }
    expect(checked).toBeGreaterThan(8);
  });

  it('every request field named like a date is declared with a date or date-time format', () => {
    const undeclared: string[] = [];
    for (const route of routes) {
      for (const field of bodyFields(route.operation).strings) {
        const name = field.path[field.path.length - 1];
        if (/(Date|On|At|By)$/.test(name) && !field.schema.format) undeclared.push(fieldLabel(route, field));
      }
    }
    expect(undeclared).toEqual([]);
  });

  it('when a calendar window starts in year 10000 (UTC), then the answer is 400 naming it', async () => {
    expect(await refusedInQueries((s) => s.format === 'date-time', '9999-12-31T23:00:00-05:00')).toBeGreaterThan(0);
  });
});

describe('bodies of every route', () => {
  it('when a body carries a field the route does not know, then the answer is 400 naming it', async () => {
    let checked = 0;
    for (const route of routes) {
      for (const object of bodyFields(route.operation).objects) {
        if (object.path.length > 0 && object.schema.additionalProperties !== false) {
          // The analysis settings (column mapping, options, rubric) are also stored and read back with the engine's
          // schemas, which tolerate keys they do not know; every other nested object must be strict.
          expect(object.path.join('.'), `${route.method} ${route.path}`).toMatch(/^(mapping|options|rubric)(\.|$)/);
          continue;
        }
        const unknown = [...object.path, 'colourTypo'].join('.');
        const response = await send(route, concretePath(route.path), bodyWith([...object.path, 'colourTypo'], 1));
        expect(response.status, `${route.method} ${route.path} ${unknown}`).toBe(400);
        expect(response.body.error.fields, `${route.method} ${route.path}`).toHaveProperty([unknown]);
        if (object.path.length === 0) expect(response.body.error.message).toContain('colourTypo');
        checked += 1;
      }
    }
    expect(checked).toBeGreaterThan(20);
  });

  it('when a body is sent as something other than JSON, then the answer is 415', async () => {
    let checked = 0;
    for (const route of routes.filter((r) => r.operation.requestBody)) {
      for (const [contentType, body] of [
        ['text/plain', '{"title":"A"}'],
        ['application/x-www-form-urlencoded', 'title=A'],
        ['application/xml', '<title>A</title>'],
      ]) {
        const response = await send(route, concretePath(route.path), body, contentType);
        expect(response.status, `${route.method} ${route.path} as ${contentType}`).toBe(415);
        expect(response.body.error.code).toBe('unsupported_media_type');
      }
      checked += 1;
    }
    expect(checked).toBeGreaterThan(20);
  });
});

describe('path ids of every route', () => {
  const malformed = ['0x3', ' 3', '3 ', '3.0', '1e2', '-3', '+3', '3a', '0', '03', '99999999999999999999'];

  it('when an id in the path is not a plain positive decimal integer, then the answer is 400 naming it', async () => {
    let checked = 0;
    for (const route of routes) {
      const idParameters = (route.operation.parameters ?? []).filter(
        (p) => p.in === 'path' && variants(p.schema).some((s) => s.type === 'integer' || s.type === 'number'),
      );
      for (const parameter of idParameters) {
        for (const value of malformed) {
          const path = concretePath(route.path, { [parameter.name]: encodeURIComponent(value) });
          const body = route.operation.requestBody?.content['application/json'] ? {} : undefined;
          const response = await send(route, path, body);
          expect(response.status, `${route.method} ${path}`).toBe(400);
          expect(response.body.error.fields, `${route.method} ${path}`).toHaveProperty([parameter.name]);
        }
        checked += 1;
      }
    }
    expect(checked).toBeGreaterThan(20);
  });
});

describe('dates in the database', () => {
  it('a DATE comes back as the stored text, so years 0000–0099 are never read as 1900–1999', async () => {
    const dataSource = await testDataSource();
    // MariaDB keeps DATE values from 0000-01-01 (MariaDB documentation, "DATE"); the driver must not remap them.
    const [row] = await dataSource.query("SELECT CAST('0050-03-04' AS DATE) AS d, CAST('2025-06-02' AS DATE) AS e");
    expect(row).toEqual({ d: '0050-03-04', e: '2025-06-02' });
  });
});
