import { randomBytes } from 'node:crypto';
import { beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { SessionEntity } from '../../server/entities/session.entity';
import { roles, type Role } from '../../shared/schemas/common';
import { registeredRoutes } from './support/registered-routes';
import { createTestUser, testApp, testDataSource, TEST_HOST, TEST_ORIGIN, type TestApp } from './support/test-app';

type Caller = Role | 'anonymous';
const everyone: Caller[] = ['anonymous', ...roles];
const staff: Caller[] = [...roles];

/**
 * Who may call each API route. Every route registered on the Express router must have an entry here,
 * so a new route cannot ship without someone deciding who may call it.
 */
const allowed: Record<string, Caller[]> = {
  'GET /api/health': everyone,
  'GET /api/openapi.json': everyone,
  'POST /api/auth/sign-in': everyone,
  'POST /api/auth/sign-out': staff,
  'GET /api/auth/session': staff,
  'POST /api/account/password': staff,
  'GET /api/account/sessions': staff,
  'DELETE /api/account/sessions/:sessionId': staff,
  'GET /api/users': ['admin'],
  'POST /api/users': ['admin'],
  'PATCH /api/users/:id': ['admin'],
  'POST /api/users/:id/invitation': ['admin'],
  'GET /api/invitations/:token': everyone,
  'POST /api/invitations/:token/accept': everyone,
  'POST /api/log-check/analyse': ['tester', 'editor'],
  // Roundup planning (issue 4): admins read everything and change nothing.
  'GET /api/catalog/products': staff,
  'POST /api/catalog/products': ['editor', 'tester'],
  'GET /api/catalog/products/:id': staff,
  'PATCH /api/catalog/products/:id': ['editor', 'tester'],
  'DELETE /api/catalog/products/:id': ['editor'],
  'GET /api/catalog/products/:id/prices': staff,
  'POST /api/catalog/products/:id/prices': ['editor', 'tester'],
  'DELETE /api/catalog/products/:id/prices/:priceId': ['editor'],
  'POST /api/catalog/import/preview': ['editor', 'tester'],
  'POST /api/catalog/import/commit': ['editor', 'tester'],
  'GET /api/catalog/export.csv': staff,
  'GET /api/bench-profiles': staff,
  'POST /api/bench-profiles': ['editor'],
  'GET /api/bench-profiles/:id': staff,
  'PATCH /api/bench-profiles/:id': ['editor'],
  'GET /api/load-configurations': staff,
  'POST /api/load-configurations': ['editor'],
  'GET /api/load-configurations/:id': staff,
  'PATCH /api/load-configurations/:id': ['editor'],
  'GET /api/roundups': staff,
  'POST /api/roundups': ['editor'],
  'GET /api/roundups/:id': staff,
  'PATCH /api/roundups/:id': ['editor'],
  'PUT /api/roundups/:id/load-configurations': ['editor'],
  'POST /api/roundups/:id/state': ['editor'],
  'GET /api/roundups/:id/history': staff,
  'GET /api/roundups/:id/entries': staff,
  'POST /api/roundups/:id/entries': ['editor'],
  'DELETE /api/roundups/:id/entries/:entryId': ['editor'],
  'GET /api/roundups/:id/suggestions': ['editor'],
  'GET /api/roundups/:id/reference-candidates': ['editor'],
  'GET /api/roundups/:id/matrix': staff,
  'POST /api/roundups/:id/assignments': ['editor'],
  'POST /api/roundups/:id/cells/:cellId/transitions': ['editor', 'tester'],
  'GET /api/testers': ['editor'],
  'GET /api/roundups/:id/samples': staff,
  'PATCH /api/roundups/:id/samples/:sampleId': ['editor', 'tester'],
  'GET /api/benches': staff,
  'POST /api/benches': ['editor'],
  'PATCH /api/benches/:id': ['editor'],
  'GET /api/bookings': staff,
  'GET /api/benches/:id/bookings': staff,
  'POST /api/benches/:id/bookings': ['tester'],
  'DELETE /api/benches/:id/bookings/:bookingId': ['editor', 'tester'],
  'GET /api/benches/:id/detail': staff,
  'POST /api/benches/:id/instruments': ['editor'],
  'PATCH /api/benches/:id/instruments/:instrumentId': ['editor'],
  'POST /api/benches/:id/maintenance': ['editor', 'tester'],
  'GET /api/my-bench': ['tester'],
  'GET /api/account/calendar-feed': ['tester'],
  'POST /api/account/calendar-feed': ['tester'],
  'DELETE /api/account/calendar-feed': ['tester'],
  // The secret token in the address is the key (calendar apps have no session); a wrong token is 404.
  'GET /api/calendar/:token.ics': everyone,
  'GET /api/dashboard': staff,
  // Bench capture: staff read results; testers and editors record; editors review and set the rubric.
  'GET /api/cells/:cellId/runs': staff,
  'POST /api/cells/:cellId/runs': ['editor', 'tester'],
  'POST /api/cells/:cellId/manual-runs': ['editor', 'tester'],
  'GET /api/runs/:runId': staff,
  'GET /api/runs/:runId/logger-file': staff,
  'POST /api/runs/:runId/analyses': ['editor', 'tester'],
  'POST /api/runs/:runId/review': ['editor'],
  'POST /api/runs/:runId/run-of-record': ['editor'],
  'GET /api/roundups/:id/results': staff,
  'PUT /api/roundups/:id/rubric': ['editor'],
  'GET /api/roundups/:id/entries/:entryId/photos': staff,
  'POST /api/roundups/:id/entries/:entryId/photos': ['editor', 'tester'],
  'PUT /api/roundups/:id/entries/:entryId/photo-order': ['editor', 'tester'],
  'PATCH /api/photos/:photoId': ['editor', 'tester'],
  'DELETE /api/photos/:photoId': ['editor', 'tester'],
  'GET /api/photos/:photoId/files/:size': staff,
  // Write-up (issue 9): writers and editors write and comment, editors sign off; every role reads.
  'GET /api/roundups/:id/write-up': staff,
  'GET /api/roundups/:id/write-up/preview': staff,
  'GET /api/write-up/sections/:sectionId': staff,
  'PUT /api/write-up/sections/:sectionId': ['editor', 'writer'],
  'POST /api/write-up/sections/:sectionId/review-request': ['editor', 'writer'],
  'POST /api/write-up/sections/:sectionId/sign-off': ['editor'],
  'POST /api/write-up/sections/:sectionId/hand-back': ['editor'],
  'GET /api/write-up/sections/:sectionId/revisions': staff,
  'GET /api/write-up/sections/:sectionId/revisions/:revisionId': staff,
  'POST /api/write-up/sections/:sectionId/revisions/:revisionId/restore': ['editor', 'writer'],
  'GET /api/write-up/sections/:sectionId/comments': staff,
  'POST /api/write-up/sections/:sectionId/comments': ['editor', 'writer'],
  'POST /api/write-up/comments/:commentId/resolve': ['editor', 'writer'],
  'POST /api/write-up/comments/:commentId/reopen': ['editor', 'writer'],
  // Mail (issue 11): the local relay's dev inbox is for admins.
  'GET /api/dev-inbox': ['admin'],
  'GET /api/dev-inbox/:id': ['admin'],
  'GET /api/dev-inbox/:id/html': ['admin'],
  // Readers sign up without an account (rate-limited; the same answer for every address); editors keep the subjects
  // and the roundups' mailings; the relay's webhook carries a shared secret instead of a session.
  'GET /api/mail-categories': everyone,
  'POST /api/subscribers': everyone,
  'POST /api/subscribers/confirm': everyone,
  'GET /api/subscriber-categories': staff,
  'POST /api/subscriber-categories': ['editor'],
  'PATCH /api/subscriber-categories/:id': ['editor'],
  'DELETE /api/subscriber-categories/:id': ['editor'],
  'GET /api/roundups/:id/mailings': ['editor'],
  'POST /api/roundups/:id/mailings': ['editor'],
  'POST /api/roundups/:id/mailings/test': ['editor'],
  'GET /api/account/mail': staff,
  'PUT /api/account/mail': staff,
  'POST /api/mail/events': everyone,
  // Editorial: staff read verdicts, charts and readiness; editors decide verdicts, approve charts, leave cells out;
  // writers and editors send a roundup to review.
  'GET /api/roundups/:id/verdicts': staff,
  'PUT /api/roundups/:id/verdicts/:entryId': ['editor'],
  'GET /api/roundups/:id/charts': staff,
  'PUT /api/roundups/:id/charts/:chartKey/settings': ['editor'],
  'POST /api/roundups/:id/charts/:chartKey/approval': ['editor'],
  'GET /api/roundups/:id/charts/:chartKey/image.png': staff,
  'GET /api/roundups/:id/readiness': staff,
  'POST /api/roundups/:id/review-request': ['editor', 'writer'],
  'PUT /api/roundups/:id/cells/:cellId/exclusion': ['editor'],
  'DELETE /api/roundups/:id/cells/:cellId/exclusion': ['editor'],
  // Publishing (issue 10): editors schedule, publish updates and share preview links.
  'GET /api/roundups/:id/publishing': staff,
  'PUT /api/roundups/:id/schedule': ['editor'],
  'DELETE /api/roundups/:id/schedule': ['editor'],
  'POST /api/roundups/:id/publication-updates': ['editor'],
  'POST /api/roundups/:id/preview-links': ['editor'],
  'GET /api/roundups/:id/open-data': ['editor', 'admin'],
  'PUT /api/roundups/:id/open-data': ['editor', 'admin'],
};

let app: TestApp;
const cookies = new Map<Role, () => Promise<string>>();

beforeAll(async () => {
  app = await testApp({ SIGN_IN_LIMIT_PER_IP: '100000', SIGN_IN_LIMIT_PER_ACCOUNT: '100000' });
  const ds = await testDataSource();
  for (const role of roles) {
    const user = await createTestUser(role);
    // A fresh session per call, so routes that end a session do not spoil the next call.
    cookies.set(role, async () => {
      const id = randomBytes(20).toString('hex');
      await ds
        .getRepository(SessionEntity)
        .insert({ id, userId: user.id, expiresAt: new Date(Date.now() + 3_600_000) });
      return `benchwire_session=${id}`;
    });
  }
});

/** Every /api route the app registers, as "METHOD /path". */
const routes = () => [
  ...new Set(
    registeredRoutes(app)
      .filter((route) => route.path.startsWith('/api/'))
      .map((route) => `${route.method} ${route.path}`),
  ),
];

describe('role × route matrix', () => {
  it('every registered /api route has an entry in the table, and every entry is a registered route', () => {
    const registered = routes();
    expect(registered.length).toBeGreaterThan(5);
    expect(
      registered.filter((r) => !(r in allowed)),
      'routes missing from the access table',
    ).toEqual([]);
    expect(
      Object.keys(allowed).filter((r) => !registered.includes(r)),
      'table entries with no route',
    ).toEqual([]);
  });

  // Every route × every caller, one request each: several hundred requests, slow on a busy machine.
  it('each caller gets the expected answer from each route', async () => {
    const failures: string[] = [];
    for (const route of routes()) {
      const [method, path] = route.split(' ');
      const url = path.replace(/:(\w+)/g, '999999');
      for (const caller of everyone) {
        let call = request(app)[method.toLowerCase() as 'get'](url).set('Host', TEST_HOST).set('Origin', TEST_ORIGIN);
        if (caller !== 'anonymous') call = call.set('Cookie', await cookies.get(caller)!());
        if (method !== 'GET' && method !== 'DELETE') call = call.send({});
        const status = (await call).status;
        const mayCall = allowed[route]?.includes(caller);
        const expected = mayCall ? 'not 401/403/5xx' : caller === 'anonymous' ? '401' : '403';
        const ok = mayCall
          ? ![401, 403].includes(status) && status < 500
          : status === (caller === 'anonymous' ? 401 : 403);
        if (!ok) failures.push(`${route} as ${caller}: got ${status}, expected ${expected}`);
      }
    }
    expect(failures).toEqual([]);
  }, 180_000);

  it('the OpenAPI document lists every route with the roles that may call it', async () => {
    const document = (await request(app).get('/api/openapi.json')).body;
    expect(document.openapi).toBe('3.1.0');
    for (const route of routes()) {
      const [method, path] = route.split(' ');
      const operation = document.paths[path.replace(/:(\w+)/g, '{$1}')]?.[method.toLowerCase()];
      expect(operation, `${route} is missing from openapi.json`).toBeTruthy();
      const expectedRoles = allowed[route].filter((c) => c !== 'anonymous');
      expect(operation['x-benchwire-roles'].filter((c: string) => c !== 'anonymous').sort()).toEqual(
        [...expectedRoles].sort(),
      );
    }
  });
});
