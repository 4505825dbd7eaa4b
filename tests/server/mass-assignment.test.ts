import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import type { DataSource } from 'typeorm';
import { createApp } from '../../server/app';
import { createDataSource, initializeDataSource } from '../../server/data-source';
import { setUpDatabase } from '../../server/database-setup';
import { demoAccounts } from '../../server/seed/demo-staff';
import { TEST_HOST, TEST_ORIGIN, testEnv } from './support/test-app';

/**
 * Mass assignment: every JSON body route, called by every role it admits, with fields a caller must never set
 * through a form (ids, roles, approval, publication, states, authorship, timestamps). Bodies are strict, so each
 * is refused with 400 naming every such field, and the database — the seeded demo outlet on a database of this
 * file's own — is byte for byte what it was (CHECKSUM TABLE on every table).
 */

const forbiddenFields = {
  id: 999,
  role: 'admin',
  approved: true,
  approvedAt: '2026-01-01T00:00:00.000Z',
  publishedAt: '2026-01-01T00:00:00.000Z',
  state: 'live',
  active: true,
  createdBy: 1,
  createdAt: '2026-01-01T00:00:00.000Z',
  updatedAt: '2026-01-01T00:00:00.000Z',
  userId: 1,
  testerId: 1,
  reviewedBy: 1,
  reviewState: 'accepted',
  passwordHash: 'x',
  isRunOfRecord: true,
};

interface JsonSchema {
  properties?: Record<string, unknown>;
  anyOf?: JsonSchema[];
  oneOf?: JsonSchema[];
  allOf?: JsonSchema[];
}

/** Top-level field names a body schema declares, across its alternatives. */
function declaredFields(schema: JsonSchema | undefined): Set<string> {
  const names = new Set<string>();
  const visit = (node: JsonSchema | undefined) => {
    if (!node) return;
    Object.keys(node.properties ?? {}).forEach((name) => names.add(name));
    [...(node.anyOf ?? []), ...(node.oneOf ?? []), ...(node.allOf ?? [])].forEach(visit);
  };
  visit(schema);
  return names;
}

const url = (() => {
  const base = new URL(testEnv().DATABASE_URL);
  base.pathname = `${base.pathname}_mass`;
  return base.toString();
})();
let dataSource: DataSource;

beforeAll(async () => {
  await setUpDatabase(url, { fresh: true, seed: true, quiet: true });
  dataSource = await initializeDataSource(createDataSource(url, { poolSize: 3 }));
}, 120_000);

afterAll(async () => {
  await dataSource?.destroy();
  await setUpDatabase(url, { drop: true });
});

async function checksums() {
  const tables = (await dataSource.query(
    "SELECT TABLE_NAME AS name FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE() AND TABLE_TYPE = 'BASE TABLE' ORDER BY TABLE_NAME",
  )) as { name: string }[];
  const sums: Record<string, string> = {};
  for (const { name } of tables) {
    const [{ Checksum }] = await dataSource.query(`CHECKSUM TABLE \`${name}\` EXTENDED`);
    sums[name] = String(Checksum);
  }
  return sums;
}

describe('mass assignment', () => {
  it('fields no form may set are refused with 400 on every JSON body route, for every role, and nothing changes', async () => {
    const app = createApp({ dataSource, env: testEnv({ DATABASE_URL: url, SIGN_IN_LIMIT_PER_ACCOUNT: '1000' }) });
    const agents = new Map<string, ReturnType<typeof request.agent>>();
    for (const account of demoAccounts) {
      if (agents.has(account.role)) continue;
      const agent = request.agent(app).set('Host', TEST_HOST).set('Origin', TEST_ORIGIN);
      const signIn = await agent.post('/api/auth/sign-in').send({ email: account.email, password: account.password });
      expect(signIn.status, signIn.text).toBe(200);
      agents.set(account.role, agent);
    }
    const document = (await agents.get('admin')!.get('/api/openapi.json')).body as {
      paths: Record<
        string,
        Record<
          string,
          {
            'x-benchwire-roles': string[];
            requestBody?: { content: Record<string, { schema: JsonSchema }> };
          }
        >
      >;
    };
    const before = await checksums();

    const problems: string[] = [];
    let checked = 0;
    for (const [path, operations] of Object.entries(document.paths)) {
      for (const [method, operation] of Object.entries(operations)) {
        const schema = operation.requestBody?.content['application/json']?.schema;
        if (!schema) continue;
        const declared = declaredFields(schema);
        const body = Object.fromEntries(Object.entries(forbiddenFields).filter(([name]) => !declared.has(name)));
        // The demo outlet's first rows: real objects, so nothing but the body stands in the way.
        const address = path.replace(/\{(\w+)\}/g, '1');
        const callers = operation['x-benchwire-roles'].filter((role) => agents.has(role));
        for (const role of callers.length > 0 ? callers : ['admin']) {
          const agent = agents.get(role)!;
          const call = (agent as unknown as Record<string, (u: string) => request.Test>)[method];
          const response = await call.call(agent, address).send(body);
          checked += 1;
          const label = `${method.toUpperCase()} ${path} as ${role}`;
          if (response.status !== 400) {
            problems.push(`${label}: ${response.status} ${response.text.slice(0, 200)}`);
            continue;
          }
          const named = Object.keys(response.body.error?.fields ?? {});
          const unnamed = Object.keys(body).filter((name) => !named.includes(name));
          if (unnamed.length > 0) problems.push(`${label}: 400 without naming ${unnamed.join(', ')}`);
        }
      }
    }
    expect(problems).toEqual([]);
    expect(checked).toBeGreaterThan(40);
    expect(await checksums()).toEqual(before);
  }, 180_000);
});
