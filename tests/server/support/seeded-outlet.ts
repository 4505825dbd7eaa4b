import { afterAll, beforeAll, expect } from 'vitest';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { createApp } from '../../../server/app';
import { createDataSource, initializeDataSource } from '../../../server/data-source';
import { setUpDatabase } from '../../../server/database-setup';
import type { Env } from '../../../server/env';
import { demoAccounts } from '../../../server/seed/demo-staff';
import { TEST_HOST, TEST_ORIGIN, testEnv } from './test-app';

/** The test database's URL with `_<suffix>` added to its name: a throwaway database of one test file. */
export function testDatabaseUrl(suffix: string): string {
  const url = new URL(testEnv().DATABASE_URL);
  url.pathname = `${url.pathname}_${suffix}`;
  return url.toString();
}

/**
 * The seeded demo outlet on a database of the calling file's own, created before its tests and dropped after.
 * Route-wide sweeps use it to call every route on real rows. Each sweep keeps its own copy: one writes what it is
 * sent while another proves nothing changed, and test files run side by side.
 */
export function seededOutlet(suffix: string) {
  const url = testDatabaseUrl(suffix);
  let dataSource: DataSource | undefined;

  beforeAll(async () => {
    await setUpDatabase(url, { fresh: true, seed: true, quiet: true });
    dataSource = await initializeDataSource(createDataSource(url, { poolSize: 3 }));
  }, 120_000);

  afterAll(async () => {
    await dataSource?.destroy();
    await setUpDatabase(url, { drop: true });
  });

  const outlet = {
    url,
    dataSource(): DataSource {
      if (!dataSource) throw new Error('The seeded outlet is ready only inside the tests of its file.');
      return dataSource;
    },
    app(overrides: Partial<Record<keyof Env, string>> = {}) {
      return createApp({ dataSource: outlet.dataSource(), env: testEnv({ DATABASE_URL: url, ...overrides }) });
    },
  };
  return outlet;
}

export type DemoAgent = ReturnType<typeof request.agent>;

/** One signed-in agent per role, each a demo account of that role. */
export async function demoAgentsByRole(app: ReturnType<typeof createApp>): Promise<Map<string, DemoAgent>> {
  const agents = new Map<string, DemoAgent>();
  for (const account of demoAccounts) {
    if (agents.has(account.role)) continue;
    const agent = request.agent(app).set('Host', TEST_HOST).set('Origin', TEST_ORIGIN);
    const signIn = await agent.post('/api/auth/sign-in').send({ email: account.email, password: account.password });
    expect(signIn.status, signIn.text).toBe(200);
    agents.set(account.role, agent);
  }
  return agents;
}

/** A route that takes a JSON body, as the OpenAPI document lists it. */
export interface JsonBodyRoute<Schema> {
  path: string;
  method: string;
  roles: string[];
  schema: Schema;
  /** The path with every parameter set to 1: the demo outlet's first rows, real objects. */
  address: string;
}

/** Every route the app's OpenAPI document lists with a JSON request body. */
export async function jsonBodyRoutes<Schema>(agent: DemoAgent): Promise<JsonBodyRoute<Schema>[]> {
  const document = (await agent.get('/api/openapi.json')).body as {
    paths: Record<
      string,
      Record<string, { 'x-benchwire-roles': string[]; requestBody?: { content: Record<string, { schema: Schema }> } }>
    >;
  };
  return Object.entries(document.paths).flatMap(([path, operations]) =>
    Object.entries(operations).flatMap(([method, operation]) => {
      const schema = operation.requestBody?.content['application/json']?.schema;
      if (!schema) return [];
      return [
        { path, method, roles: operation['x-benchwire-roles'], schema, address: path.replace(/\{(\w+)\}/g, '1') },
      ];
    }),
  );
}

/** Sends `body` with the route's method from `agent`. */
export function send(agent: DemoAgent, method: string, address: string, body: unknown): request.Test {
  const call = (agent as unknown as Record<string, (u: string) => request.Test>)[method];
  return call.call(agent, address).send(body as object);
}
