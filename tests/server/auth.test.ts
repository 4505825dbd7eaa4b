import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { client, createTestUser, signedIn, testApp, TEST_HOST } from './support/test-app';

describe('signing in and out', () => {
  it('when a tester signs in with the right password, then the session cookie is set and the session names them', async () => {
    const app = await testApp();
    const user = await createTestUser('tester');
    const agent = client(app);
    const response = await agent
      .post('/api/auth/sign-in')
      .send({ email: user.email.toUpperCase(), password: user.password });
    expect(response.status).toBe(200);
    expect(response.body.user).toMatchObject({ email: user.email, role: 'tester' });
    const cookie = String(response.headers['set-cookie']);
    expect(cookie).toMatch(/benchwire_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    const session = await agent.get('/api/auth/session');
    expect(session.status).toBe(200);
    expect(session.body.user.id).toBe(user.id);
  });

  it('when someone signs out, then the same cookie no longer opens a session', async () => {
    const app = await testApp();
    const { agent } = await signedIn(app, 'writer');
    expect((await agent.post('/api/auth/sign-out')).status).toBe(200);
    const after = await agent.get('/api/auth/session');
    expect(after.status).toBe(401);
    expect(after.body.error.code).toBe('unauthenticated');
  });

  it('when the password is wrong or the account does not exist, then both answer alike with no hint', async () => {
    const app = await testApp();
    const user = await createTestUser('editor');
    const wrong = await client(app).post('/api/auth/sign-in').send({ email: user.email, password: 'not-the-password' });
    const unknown = await client(app)
      .post('/api/auth/sign-in')
      .send({ email: 'nobody@test.soaksheet.example', password: 'whatever-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
    expect(wrong.body.error).toEqual({ code: 'invalid_credentials', message: expect.stringMatching(/do not match/) });
  });

  it('when the form is incomplete, then the answer is 400 with a message per field', async () => {
    const app = await testApp();
    const response = await client(app).post('/api/auth/sign-in').send({ email: 'not-an-address', password: '' });
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('validation_failed');
    expect(Object.keys(response.body.error.fields)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('when a deactivated user tries to sign in, then they are refused like a wrong password', async () => {
    const app = await testApp();
    const user = await createTestUser('tester', { active: false });
    const response = await client(app).post('/api/auth/sign-in').send({ email: user.email, password: user.password });
    expect(response.status).toBe(401);
    expect(response.body.error.code).toBe('invalid_credentials');
  });

  it('when the body is not JSON, then the error is still JSON with a code', async () => {
    const app = await testApp();
    const response = await client(app)
      .post('/api/auth/sign-in')
      .set('Content-Type', 'application/json')
      .send('{"email":');
    expect(response.status).toBe(400);
    expect(response.body.error.code).toBe('bad_request');
  });
});

describe('cross-site request protection', () => {
  it('when a POST carries a foreign Origin, then it is refused with 403 and nothing happens', async () => {
    const app = await testApp();
    const user = await createTestUser('admin');
    const response = await request(app)
      .post('/api/auth/sign-in')
      .set('Host', TEST_HOST)
      .set('Origin', 'https://attacker.example')
      .send({ email: user.email, password: user.password });
    expect(response.status).toBe(403);
    expect(response.body.error.code).toBe('cross_site_request');
    expect(response.headers['set-cookie']).toBeUndefined();
  });

  it('when a signed-in admin is tricked into a cross-site POST, then no user is created', async () => {
    const app = await testApp();
    const { agent } = await signedIn(app, 'admin');
    const response = await agent.post('/api/users').set('Origin', 'https://attacker.example').send({
      email: 'planted@test.soaksheet.example',
      displayName: 'Planted',
      role: 'admin',
      password: 'planted-password-1',
    });
    expect(response.status).toBe(403);
    const list = await agent.get('/api/users');
    expect(list.body.users.map((u: { email: string }) => u.email)).not.toContain('planted@test.soaksheet.example');
  });

  it('when a POST has no Origin at all, then it is refused', async () => {
    const app = await testApp();
    const response = await request(app)
      .post('/api/auth/sign-in')
      .set('Host', TEST_HOST)
      .send({ email: 'a@b.example', password: 'x' });
    expect(response.status).toBe(403);
  });

  it('GET requests need no Origin', async () => {
    const app = await testApp();
    expect((await request(app).get('/api/health').set('Host', TEST_HOST)).status).toBe(200);
  });
});

describe('sign-in rate limits', () => {
  it('when one account gets too many wrong passwords, then further attempts get 429 even with the right one', async () => {
    const app = await testApp({ SIGN_IN_LIMIT_PER_ACCOUNT: '3', SIGN_IN_LIMIT_PER_IP: '100' });
    const user = await createTestUser('writer');
    for (let i = 0; i < 3; i++) {
      expect(
        (await client(app).post('/api/auth/sign-in').send({ email: user.email, password: 'wrong-password' })).status,
      ).toBe(401);
    }
    const blocked = await client(app).post('/api/auth/sign-in').send({ email: user.email, password: user.password });
    expect(blocked.status).toBe(429);
    expect(blocked.body.error.code).toBe('rate_limited');
  });

  it('when one address tries many accounts, then the per-address limit answers 429', async () => {
    const app = await testApp({ SIGN_IN_LIMIT_PER_IP: '4', SIGN_IN_LIMIT_PER_ACCOUNT: '100' });
    const statuses: number[] = [];
    for (let i = 0; i < 5; i++) {
      statuses.push(
        (
          await client(app)
            .post('/api/auth/sign-in')
            .send({ email: `probe${i}@test.soaksheet.example`, password: 'guess-guess' })
        ).status,
      );
    }
    expect(statuses).toEqual([401, 401, 401, 401, 429]);
  });
});

describe('health', () => {
  it('reports the database as up', async () => {
    const app = await testApp();
    const response = await request(app).get('/api/health');
    expect(response.status).toBe(200);
    expect(response.body).toMatchObject({ status: 'ok', database: 'up' });
  });

  it('unknown API paths answer 404 in the error shape', async () => {
    const app = await testApp();
    const response = await request(app).get('/api/no-such-thing');
    expect(response.status).toBe(404);
    expect(response.body.error.code).toBe('not_found');
  });
});
