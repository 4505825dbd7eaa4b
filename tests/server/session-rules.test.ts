import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { createApp } from '../../server/app';
import { SessionEntity } from '../../server/entities/session.entity';
import {
  client,
  createTestUser,
  signedIn,
  testApp,
  testDataSource,
  testEnv,
  TEST_HOST,
  TEST_ORIGIN,
} from './support/test-app';

/** Session cookies, their limits in time, cross-site requests and client addresses behind a proxy. */

const DAY = 86_400_000;

describe('the session cookie', () => {
  it('on HTTPS (production) it is __Host- prefixed, Secure, HttpOnly, SameSite=Lax, Path=/ and has no Domain', async () => {
    // RFC 6265bis §4.1.3.2: a __Host- cookie must be Secure, have Path=/ and no Domain, or browsers drop it.
    const app = await testApp({ NODE_ENV: 'production', COOKIE_SECURE: 'auto' });
    const user = await createTestUser('writer');
    const response = await request(app)
      .post('/api/auth/sign-in')
      .set('Host', TEST_HOST)
      .set('Origin', TEST_ORIGIN)
      .send({ email: user.email, password: user.password });
    expect(response.status).toBe(200);
    const cookie = String(response.headers['set-cookie']);
    expect(cookie).toMatch(/^__Host-benchwire_session=/);
    expect(cookie).toMatch(/;\s*Secure/i);
    expect(cookie).toMatch(/;\s*HttpOnly/i);
    expect(cookie).toMatch(/;\s*SameSite=Lax/i);
    expect(cookie).toMatch(/;\s*Path=\//i);
    expect(cookie).not.toMatch(/Domain=/i);
    const token = /__Host-benchwire_session=([^;]+)/.exec(cookie)![1];
    const session = await request(app)
      .get('/api/auth/session')
      .set('Host', TEST_HOST)
      .set('Cookie', `__Host-benchwire_session=${token}`);
    expect(session.status).toBe(200);
  });

  it('the API description names the cookie the session store sets: __Host- on HTTPS, plain otherwise', async () => {
    const cookieIn = async (overrides: Record<string, string>) => {
      const document = (
        await request(await testApp(overrides))
          .get('/api/openapi.json')
          .set('Host', TEST_HOST)
      ).body;
      return document.components.securitySchemes.sessionCookie.name as string;
    };
    expect(await cookieIn({ NODE_ENV: 'production', COOKIE_SECURE: 'auto' })).toBe('__Host-benchwire_session');
    expect(await cookieIn({ COOKIE_SECURE: 'false' })).toBe('benchwire_session');
  });
});

describe('session limits in time', () => {
  it('a session idle past its expiry is refused and its cookie cleared', async () => {
    const app = await testApp({ SESSION_DAYS: '14' });
    const { agent, user } = await signedIn(app, 'tester');
    // Idle: lucia renews the expiry while the session is used; untouched, the expiry passes.
    await (
      await testDataSource()
    )
      .getRepository(SessionEntity)
      .update({ userId: user.id }, { expiresAt: new Date(Date.now() - 1000) });
    const response = await agent.get('/api/auth/session');
    expect(response.status).toBe(401);
    expect(String(response.headers['set-cookie'])).toMatch(/benchwire_session=;/);
  });

  it('a session in daily use still ends SESSION_ABSOLUTE_DAYS after sign-in, by the app’s clock', async () => {
    let now = Date.now();
    const app = createApp({
      dataSource: await testDataSource(),
      env: testEnv({ SESSION_DAYS: '14', SESSION_ABSOLUTE_DAYS: '30' }),
      now: () => now,
    });
    const { agent, user } = await signedIn(app, 'editor');
    now += 29 * DAY;
    expect((await agent.get('/api/auth/session')).status).toBe(200);
    now += 1 * DAY + 1000;
    const refused = await agent.get('/api/auth/session');
    expect(refused.status).toBe(401);
    expect(String(refused.headers['set-cookie'])).toMatch(/benchwire_session=;/);
    expect(await (await testDataSource()).getRepository(SessionEntity).countBy({ userId: user.id })).toBe(0);
  });
});

interface RouteLayer {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: RouteLayer[] };
}

describe('cross-site requests', () => {
  it('every state-changing route refuses a foreign Origin with 403 before doing anything', async () => {
    const app = await testApp();
    const editor = await createTestUser('editor');
    const signIn = await client(app).post('/api/auth/sign-in').send({ email: editor.email, password: editor.password });
    const cookie = String(signIn.headers['set-cookie']).split(';')[0];
    const routes: [string, string][] = [];
    const walk = (stack: RouteLayer[]) => {
      for (const layer of stack) {
        if (layer.route?.path.startsWith('/api/')) {
          for (const method of Object.keys(layer.route.methods)) {
            if (!['get', 'head', 'options', '_all'].includes(method)) routes.push([method, layer.route.path]);
          }
        } else if (layer.handle?.stack) walk(layer.handle.stack);
      }
    };
    walk((app as unknown as { router: { stack: RouteLayer[] } }).router.stack);
    expect(routes.length).toBeGreaterThan(30);
    const problems: string[] = [];
    for (const [method, path] of routes) {
      for (const origin of ['https://attacker.example', 'null', `http://${TEST_HOST}.attacker.example`]) {
        const call = (request(app) as unknown as Record<string, (u: string) => request.Test>)[method];
        const response = await call(path.replace(/:(\w+)/g, '1'))
          .set('Host', TEST_HOST)
          .set('Origin', origin)
          .set('Cookie', cookie)
          .send({});
        if (response.status !== 403 || response.body.error?.code !== 'cross_site_request') {
          problems.push(`${method.toUpperCase()} ${path} from ${origin}: ${response.status}`);
        }
      }
    }
    expect(problems).toEqual([]);
  });
});

describe('client addresses behind a proxy', () => {
  it('with TRUST_PROXY off, a forged X-Forwarded-For does not spread guesses over fresh addresses', async () => {
    const app = await testApp({ TRUST_PROXY: 'false', SIGN_IN_LIMIT_PER_IP: '3', SIGN_IN_LIMIT_PER_ACCOUNT: '1000' });
    // Each guess claims another address; without a trusted proxy they all count for the socket's own address.
    // The test database is shared, so the ceiling is reached within a few guesses whatever came before.
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) {
      const response = await client(app)
        .set('X-Forwarded-For', `198.51.100.${i + 1}`)
        .post('/api/auth/sign-in')
        .send({ email: `nobody-${i}@test.soaksheet.example`, password: 'wrong-password-123' });
      statuses.push(response.status);
    }
    expect(statuses.at(-1)).toBe(429);
  });
});
