import { randomBytes } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import request from 'supertest';
import { client, createTestUser, signedIn, signIn, testApp, TEST_HOST, type TestApp } from './support/test-app';

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

  it('when someone signs in again, then the session is rotated and the old cookie is dead', async () => {
    const app = await testApp();
    const user = await createTestUser('writer');
    const agent = client(app);
    const { sessionCookie: firstCookie } = await signIn(agent, user);
    const { sessionCookie: secondCookie } = await signIn(agent, user);
    expect(firstCookie).toBeDefined();
    expect(secondCookie).toBeDefined();
    expect(secondCookie).not.toBe(firstCookie);
    const withOld = await request(app).get('/api/auth/session').set('Cookie', `benchwire_session=${firstCookie}`);
    expect(withOld.status).toBe(401);
    expect((await agent.get('/api/auth/session')).status).toBe(200);
    expect((await agent.get('/api/account/sessions')).body.sessions).toHaveLength(1);
  });

  it('answers about sessions and accounts are never stored by a cache', async () => {
    const app = await testApp();
    const user = await createTestUser('admin');
    const agent = client(app);
    const responses = [
      await client(app).post('/api/auth/sign-in').send({ email: user.email, password: 'not-the-password' }),
      (await signIn(agent, user)).response,
      await agent.get('/api/auth/session'),
      await agent.get('/api/account/sessions'),
      await agent.get('/api/users'),
      await client(app).get('/api/account/sessions'),
    ];
    expect(responses.map((r) => r.status)).toEqual([401, 200, 200, 200, 200, 401]);
    for (const response of responses) expect(response.headers['cache-control']).toBe('no-store');
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
    const { response } = await signIn(client(app), user);
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

/**
 * Each test guesses from a network of its own (behind a trusted proxy) so counters never meet, not even across
 * runs on the same database: a random /56 inside 2001:db8::/32, the documentation prefix (RFC 3849).
 */
function address() {
  const hex = randomBytes(3).toString('hex');
  return `2001:db8:${hex.slice(0, 4)}:${hex.slice(4)}00::1`;
}
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

function signInFrom(app: TestApp, from: string, email: string, password: string) {
  return client(app).set('X-Forwarded-For', from).post('/api/auth/sign-in').send({ email, password });
}

/** A 429 that says, in the header and in words, to wait at most `seconds`. */
function expectWait(response: request.Response, seconds: number, about: RegExp) {
  expect(response.status).toBe(429);
  expect(response.body.error.code).toBe('rate_limited');
  expect(Number(response.headers['retry-after'])).toBeGreaterThanOrEqual(1);
  expect(Number(response.headers['retry-after'])).toBeLessThanOrEqual(seconds);
  expect(response.body.error.message).toMatch(about);
  expect(response.body.error.message).toMatch(/Try again in \d+ (second|minute|hour)s?\./);
}

describe('password guessing', () => {
  it('when someone guesses an account’s password, then the owner still gets in once the short lock has passed', async () => {
    const app = await testApp({ TRUST_PROXY: 'true', SIGN_IN_LIMIT_PER_ACCOUNT: '3', SIGN_IN_LOCK_SECONDS: '3' });
    const owner = await createTestUser('editor');
    const attacker = address();
    for (let i = 0; i < 3; i++) expect((await signInFrom(app, attacker, owner.email, `guess-${i}`)).status).toBe(401);
    // The third wrong password started a 3 s lock: every attempt waits, the owner's too, and nothing is checked.
    expectWait(await signInFrom(app, attacker, owner.email, 'guess-3'), 3, /this account/);
    expectWait(await signInFrom(app, address(), owner.email, owner.password), 3, /this account/);
    await sleep(3100);
    // The next wrong password doubles the lock (6 s); guesses during it are refused and do not extend it.
    expect((await signInFrom(app, attacker, owner.email, 'guess-4')).status).toBe(401);
    const doubled = await signInFrom(app, attacker, owner.email, 'guess-5');
    expectWait(doubled, 6, /this account/);
    expect(Number(doubled.headers['retry-after'])).toBeGreaterThan(3);
    for (let i = 0; i < 4; i++) expectWait(await signInFrom(app, attacker, owner.email, `guess-6${i}`), 6, /account/);
    await sleep(6100);
    expect((await signInFrom(app, address(), owner.email, owner.password)).status).toBe(200);
    // The right password cleared the count: the next typo is an ordinary 401 again.
    expect((await signInFrom(app, address(), owner.email, 'a-typo')).status).toBe(401);
  });

  it('when a burst of wrong passwords arrives at once, then only the free ones are checked', async () => {
    const app = await testApp({ SIGN_IN_LIMIT_PER_ACCOUNT: '3', SIGN_IN_LOCK_SECONDS: '60' });
    const user = await createTestUser('tester');
    const statuses = await Promise.all(
      Array.from({ length: 12 }, (_, i) =>
        client(app)
          .post('/api/auth/sign-in')
          .send({ email: user.email, password: `burst-${i}` })
          .then((r) => r.status),
      ),
    );
    expect(statuses.filter((s) => s === 401)).toHaveLength(3);
    expect(statuses.filter((s) => s === 429)).toHaveLength(9);
  });

  it('when an office signs in many times from one address, then successful sign-ins never count', async () => {
    const app = await testApp({ TRUST_PROXY: 'true', SIGN_IN_LIMIT_PER_IP: '3' });
    const office = address();
    const staff = await Promise.all(Array.from({ length: 5 }, () => createTestUser('writer')));
    for (let round = 0; round < 2; round++) {
      for (const member of staff) {
        expect((await signInFrom(app, office, member.email, member.password)).status).toBe(200);
      }
    }
    // Two typos among ten sign-ins stay under the ceiling of 3 wrong passwords; so does a third after more sign-ins.
    for (const member of staff.slice(0, 2)) {
      expect((await signInFrom(app, office, member.email, 'typo')).status).toBe(401);
    }
    expect((await signInFrom(app, office, staff[4].email, staff[4].password)).status).toBe(200);
    expect((await signInFrom(app, office, staff[3].email, 'typo')).status).toBe(401);
    expect((await signInFrom(app, office, staff[2].email, staff[2].password)).status).toBe(429);
  });

  it('when one address guesses across many accounts, then it hits its ceiling and other addresses do not', async () => {
    const app = await testApp({ TRUST_PROXY: 'true', SIGN_IN_LIMIT_PER_IP: '4', SIGN_IN_WINDOW_MINUTES: '15' });
    const guesser = address();
    for (let i = 0; i < 4; i++) {
      const response = await signInFrom(
        app,
        guesser,
        `probe${i}-${randomBytes(3).toString('hex')}@test.soaksheet.example`,
        'guess',
      );
      expect(response.status).toBe(401);
    }
    const blocked = await signInFrom(app, guesser, 'probe-next@test.soaksheet.example', 'guess');
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers['retry-after'])).toBeGreaterThan(14 * 60);
    expect(Number(blocked.headers['retry-after'])).toBeLessThanOrEqual(15 * 60);
    expect(blocked.body.error.message).toMatch(/from your network\. Try again in 15 minutes\./);
    const someone = await createTestUser('writer');
    expect((await signInFrom(app, guesser, someone.email, someone.password)).status).toBe(429);
    expect((await signInFrom(app, address(), someone.email, someone.password)).status).toBe(200);
  });

  it('when a signed-in session guesses the current password, then the change-password check is throttled too', async () => {
    const app = await testApp({ SIGN_IN_LIMIT_PER_ACCOUNT: '3', SIGN_IN_LOCK_SECONDS: '4' });
    const { agent, user } = await signedIn(app, 'writer');
    const change = (currentPassword: string) =>
      agent
        .post('/api/account/password')
        .send({ currentPassword, newPassword: 'a-brand-new-pass-1', confirmPassword: 'a-brand-new-pass-1' });
    const burst = await Promise.all(Array.from({ length: 12 }, (_, i) => change(`wrong-${i}`)));
    expect(burst.filter((r) => r.status === 400)).toHaveLength(3);
    const refused = burst.filter((r) => r.status === 429);
    expect(refused).toHaveLength(9);
    for (const response of refused) expectWait(response, 4, /wrong current passwords/);
    expectWait(await change(user.password), 4, /wrong current passwords/);
    await sleep(4100);
    expect((await change(user.password)).status).toBe(200);
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
