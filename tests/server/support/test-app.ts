import { randomBytes } from 'node:crypto';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { createApp } from '../../../server/app';
import { createDataSource, initializeDataSource } from '../../../server/data-source';
import { loadEnv, type Env } from '../../../server/env';
import { hashPassword } from '../../../server/auth/passwords';
import { UserEntity } from '../../../server/entities/user.entity';
import type { Role } from '../../../shared/schemas/common';

/** Every request from the test "browser" names this host, and sends a matching Origin (CSRF check). */
export const TEST_HOST = 'benchwire.test';
export const TEST_ORIGIN = `http://${TEST_HOST}`;

let dataSource: DataSource | null = null;

/** Uploaded files of API tests land here, never in the project's uploads/ folder. */
export const testUploadsDir = join(tmpdir(), `benchwire-test-uploads-${process.pid}`);

export function testEnv(overrides: Partial<Record<keyof Env, string>> = {}): Env {
  // Every API test calls from 127.0.0.1 and the wrong-password counters live in the shared test database, so
  // the per-address ceiling is out of the way unless a test sets it (and then uses an address of its own).
  return loadEnv({
    ...process.env,
    NODE_ENV: 'test',
    COOKIE_SECURE: 'false',
    SIGN_IN_LIMIT_PER_IP: '100000',
    // Route-wide probes send many sign-ups from 127.0.0.1; the sign-up limit's own test sets it low.
    SUBSCRIBE_LIMIT_PER_IP: '100000',
    STORAGE_DRIVER: 'local',
    UPLOADS_DIR: testUploadsDir,
    ...overrides,
  });
}

/** The file's DataSource on the throwaway, migrated test database. */
export async function testDataSource(): Promise<DataSource> {
  if (!dataSource) {
    const env = testEnv();
    if (!/benchwire_test_|_dev$|_test$/.test(env.DATABASE_URL)) {
      throw new Error('API tests run only against a throwaway database: use `npm test`.');
    }
    dataSource = await initializeDataSource(createDataSource(env.DATABASE_URL, { poolSize: 5 }));
  }
  return dataSource;
}

export async function closeTestContext() {
  await dataSource?.destroy();
  dataSource = null;
}

/** A fresh app on the test database; each call has its own rate-limit counters. */
export async function testApp(overrides: Partial<Record<keyof Env, string>> = {}) {
  return createApp({ dataSource: await testDataSource(), env: testEnv(overrides) });
}

export type TestApp = Awaited<ReturnType<typeof testApp>>;

export function uniqueEmail(label = 'user') {
  return `${label}-${randomBytes(5).toString('hex')}@test.soaksheet.example`;
}

export interface TestUser {
  id: number;
  email: string;
  password: string;
  role: Role;
  displayName: string;
}

/** Creates an active staff account directly in the database. */
export async function createTestUser(
  role: Role,
  overrides: Partial<{ email: string; password: string; displayName: string; active: boolean }> = {},
): Promise<TestUser> {
  const ds = await testDataSource();
  const email = overrides.email ?? uniqueEmail(role);
  const password = overrides.password ?? `pw-${randomBytes(8).toString('hex')}`;
  const displayName = overrides.displayName ?? `Test ${role} ${randomBytes(2).toString('hex')}`;
  const saved = await ds.getRepository(UserEntity).save(
    ds.getRepository(UserEntity).create({
      email,
      displayName,
      role,
      passwordHash: await hashPassword(password),
      active: overrides.active ?? true,
    }),
  );
  return { id: saved.id, email, password, role, displayName };
}

/** A cookie-keeping client that sends the test Host and a same-site Origin on every request. */
export function client(app: TestApp) {
  return request.agent(app).set('Host', TEST_HOST).set('Origin', TEST_ORIGIN);
}

export type Client = ReturnType<typeof client>;

/** A request whose body comes back as raw bytes, whatever its type: supertest buffers only text and JSON by itself. */
export function asBytes(call: request.Test) {
  return call.buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (chunk: Buffer) => chunks.push(chunk));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
}

/** The client signs in with the user's own e-mail and password: the response, and the session cookie's value if set. */
export async function signIn(agent: Client, user: TestUser) {
  const response = await agent.post('/api/auth/sign-in').send({ email: user.email, password: user.password });
  return { response, sessionCookie: /benchwire_session=([^;]+)/.exec(String(response.headers['set-cookie']))?.[1] };
}

/** A client signed in as a new (or given) user of the role. */
export async function signedIn(app: TestApp, roleOrUser: Role | TestUser) {
  const user = typeof roleOrUser === 'string' ? await createTestUser(roleOrUser) : roleOrUser;
  const agent = client(app);
  const { response } = await signIn(agent, user);
  if (response.status !== 200) throw new Error(`sign-in failed for ${user.email}: ${response.status} ${response.text}`);
  return { agent, user };
}

/** The people of a lab test on a fresh app: an editor, a tester, another tester and a writer, each signed in. */
export async function signedInTeam(app?: TestApp) {
  const on = app ?? (await testApp());
  return {
    app: on,
    editor: await signedIn(on, 'editor'),
    tester: await signedIn(on, 'tester'),
    otherTester: await signedIn(on, 'tester'),
    writer: await signedIn(on, 'writer'),
  };
}
