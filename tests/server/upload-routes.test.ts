import { describe, expect, it } from 'vitest';
import type { ApiRegistry, RegisteredRoute } from '../../server/api-registry';
import { AuditEntryEntity } from '../../server/entities/audit-entry.entity';
import { client, signedIn, testApp, testDataSource, type Client, type TestApp } from './support/test-app';

/**
 * Every multipart route in the API registry gets the same broken uploads, so a new upload route is covered by
 * declaring it. Each must answer a 4xx JSON error with a code and a message (never 500), and write nothing.
 */

const app = await testApp();
const uploadRoutes = (app.locals.api as ApiRegistry).routes.filter(
  (route): route is RegisteredRoute & { multipart: NonNullable<RegisteredRoute['multipart']> } =>
    route.multipart !== undefined,
);

/** A concrete URL for the route's path (ids of rows that need not exist: the upload is refused before any lookup). */
const urlOf = (route: RegisteredRoute) => route.path.replace(/:\w+/g, '1');

/** One signed-in caller per role, shared by the cases, so the sign-in rate limit is not what the test measures. */
const callers = new Map<string, Promise<{ agent: Client; userId: number | null }>>();

function callerFor(testApp: TestApp, route: RegisteredRoute): Promise<{ agent: Client; userId: number | null }> {
  if (route.access === 'public') return Promise.resolve({ agent: client(testApp), userId: null });
  const role = route.access === 'signed-in' ? 'editor' : route.access[0];
  if (!callers.has(role)) {
    callers.set(
      role,
      signedIn(testApp, role).then(({ agent, user }) => ({ agent, userId: user.id })),
    );
  }
  return callers.get(role)!;
}

const fileFields = (route: RegisteredRoute) =>
  Object.entries(route.multipart?.fields ?? {})
    .filter(([, kind]) => kind === 'file')
    .map(([name]) => name);

/** A small file of the kind the route reads (the content does not matter: every case fails before it is read). */
const smallFile = Buffer.from('Time [s],VRM 1 [°C]\n0,40\n1,41\n');

/** A multipart body written by hand, so it can be cut short. */
function multipartBody(boundary: string, fieldName: string, fileName: string, content: Buffer) {
  return Buffer.concat([
    Buffer.from(
      `--${boundary}\r\nContent-Disposition: form-data; name="${fieldName}"; filename="${fileName}"\r\n` +
        'Content-Type: text/csv\r\n\r\n',
    ),
    content,
    Buffer.from(`\r\n--${boundary}--\r\n`),
  ]);
}

/** A body sent as it stands under the given Content-Type, so broken multipart reaches the server unchanged. */
const sendRaw = (agent: Client, route: RegisteredRoute, contentType: string, body: string | Buffer) =>
  agent.post(urlOf(route)).set('Content-Type', contentType).send(body);

type BrokenUpload = (
  agent: Client,
  route: RegisteredRoute & { multipart: { limit: { maxFileBytes: number } } },
) => {
  status: number[];
  send: () => Promise<{ status: number; body: { error?: { code?: unknown; message?: unknown } } }>;
};

const brokenUploads: Record<string, BrokenUpload> = {
  'a file one byte over the limit': (agent, route) => ({
    status: [413],
    send: () =>
      agent
        .post(urlOf(route))
        .attach(fileFields(route)[0], Buffer.alloc(route.multipart.limit.maxFileBytes + 1, 0x31), 'big.csv'),
  }),
  'the file in a field the route does not take': (agent, route) => ({
    status: [400],
    send: () => agent.post(urlOf(route)).attach('upload', smallFile, 'log.csv'),
  }),
  'two files where one is taken': (agent, route) => ({
    status: [400],
    send: () =>
      agent
        .post(urlOf(route))
        .attach(fileFields(route)[0], smallFile, 'one.csv')
        .attach(fileFields(route)[0], smallFile, 'two.csv'),
  }),
  'more text fields than the route takes': (agent, route) => ({
    status: [400],
    send: () => {
      let call = agent.post(urlOf(route));
      for (let index = 0; index <= (route.multipart as { limit: { maxFields: number } }).limit.maxFields; index++) {
        call = call.field(`note${index}`, 'x');
      }
      return call.attach(fileFields(route)[0], smallFile, 'log.csv');
    },
  }),
  'a text field the route does not take': (agent, route) => ({
    status: [400],
    send: () => agent.post(urlOf(route)).field('comment', 'x').attach(fileFields(route)[0], smallFile, 'log.csv'),
  }),
  'multipart/form-data without a boundary': (agent, route) => ({
    status: [400],
    send: () =>
      sendRaw(
        agent,
        route,
        'multipart/form-data',
        multipartBody('b0undary', fileFields(route)[0], 'log.csv', smallFile),
      ),
  }),
  'a body cut off in the middle of the file': (agent, route) => ({
    status: [400],
    send: () => {
      const body = multipartBody('b0undary', fileFields(route)[0], 'log.csv', Buffer.alloc(64 * 1024, 0x31));
      return sendRaw(agent, route, 'multipart/form-data; boundary=b0undary', body.subarray(0, body.length / 2));
    },
  }),
  'a malformed part header': (agent, route) => ({
    status: [400],
    send: () =>
      sendRaw(
        agent,
        route,
        'multipart/form-data; boundary=b0undary',
        Buffer.from('--b0undary\r\nContent-Disposition form-data\r\n\r\nx\r\n--b0undary--\r\n'),
      ),
  }),
  'a plain-text body': (agent, route) => ({
    status: [415],
    send: () => sendRaw(agent, route, 'text/plain', 'Time,VRM\n0,40\n'),
  }),
  'no Content-Type at all': (agent, route) => ({
    status: [415],
    send: () => agent.post(urlOf(route)).send(),
  }),
};

async function auditEntriesBy(userId: number | null): Promise<number> {
  if (userId === null) return 0;
  return (await testDataSource()).getRepository(AuditEntryEntity).countBy({ actorId: userId });
}

describe('every upload route refuses broken uploads with a clear 4xx', () => {
  it('the registry has upload routes to check (log check, catalog import)', () => {
    const paths = uploadRoutes.map((route) => route.path);
    expect(paths).toContain('/api/log-check/analyse');
    expect(paths).toContain('/api/catalog/import/preview');
    expect(paths).toContain('/api/catalog/import/commit');
  });

  for (const route of uploadRoutes) {
    describe(`${route.method.toUpperCase()} ${route.path}`, () => {
      for (const [name, broken] of Object.entries(brokenUploads)) {
        it(`${name}: 4xx with a code and a message, nothing written`, async () => {
          const { agent, userId } = await callerFor(app, route);
          const before = await auditEntriesBy(userId);
          const { status, send } = broken(agent, route as Parameters<BrokenUpload>[1]);
          const response = await send();
          expect(status, JSON.stringify(response.body)).toContain(response.status);
          expect(response.body.error).toEqual(
            expect.objectContaining({ code: expect.any(String), message: expect.any(String) }),
          );
          expect((response.body.error?.message as string).length).toBeGreaterThan(20);
          expect(await auditEntriesBy(userId)).toBe(before);
        });
      }
    });
  }

  it('the OpenAPI document states the 413 and 415 of every upload route', async () => {
    const document = (await client(app).get('/api/openapi.json')).body as {
      paths: Record<string, Record<string, { responses: Record<string, unknown> }>>;
    };
    for (const route of uploadRoutes) {
      const responses = document.paths[route.path.replace(/:(\w+)/g, '{$1}')][route.method].responses;
      expect(Object.keys(responses)).toEqual(expect.arrayContaining(['413', '415']));
    }
  });
});
